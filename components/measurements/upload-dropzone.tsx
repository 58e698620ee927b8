"use client";

import { useId } from "react";
import { buttonClass } from "@/components/ui/button";
import { useFileDrop } from "@/components/ui/use-file-drop";

/** Drop files here or choose them; every file chosen goes to onFiles. */
export function UploadDropzone({ onFiles }: { onFiles: (files: FileList) => void }) {
  const id = useId();
  const { dragging, dropProps } = useFileDrop(onFiles);
  return (
    <div
      {...dropProps}
      className={`flex flex-col items-center justify-center gap-3 border border-dashed px-6 py-10 text-center transition-colors ${
        dragging ? "border-signal bg-signal-wash" : "border-rule-strong bg-paper-bright"
      }`}
      data-testid="upload-dropzone"
    >
      <p className="text-[1.0625rem]">Drop measurement files here</p>
      <p className="text-sm text-ink-muted">.csv, .tsv, .txt, .s1p–.s4p, .ts · up to 10 MB each</p>
      <input
        id={`${id}-files`}
        type="file"
        multiple
        className="peer sr-only"
        onChange={(e) => {
          if (e.target.files) onFiles(e.target.files);
          e.target.value = "";
        }}
        data-testid="upload-file-input"
      />
      <label htmlFor={`${id}-files`} className={`${buttonClass.secondary} cursor-pointer peer-focus-visible:outline-2 peer-focus-visible:outline-signal`}>
        Choose files…
      </label>
    </div>
  );
}
