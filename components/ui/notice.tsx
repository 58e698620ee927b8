type NoticeProps = { tone?: "info" | "error" | "success"; children: React.ReactNode; id?: string };

const marks = { info: "Note", error: "Error", success: "Done" } as const;

/** A message that does not rely on colour alone: it always starts with a word saying what it is. */
export function Notice({ tone = "info", children, id }: NoticeProps) {
  const toneClass =
    tone === "error" ? "border-signal bg-signal-wash text-ink" : tone === "success" ? "border-ink bg-paper-deep" : "border-rule-strong bg-paper-deep";
  return (
    <div id={id} role={tone === "error" ? "alert" : "status"} className={`border-l-2 px-4 py-3 text-[0.9375rem] ${toneClass}`}>
      <span className={`running-head mr-2 ${tone === "error" ? "!text-signal-deep" : ""}`}>{marks[tone]}</span>
      {children}
    </div>
  );
}
