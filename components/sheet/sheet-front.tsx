import { proseLayout } from "@/lib/sheet/prose-layout";
import type { SheetModel } from "@/lib/sheet/types";
import { SheetHeading } from "./sheet-heading";
import { SheetProse } from "./sheet-prose";

type ModelProps = { model: SheetModel };

/** The preliminary banner of a sheet that is not released. */
export function SheetBanner({ header }: { header: SheetModel["header"] }) {
  if (!header.banner) return null;
  return (
    <div role="status" className="sheet-banner mb-6 border border-signal bg-signal-wash px-4 py-3">
      <p className="font-semibold tracking-[0.08em] text-signal">{header.banner}</p>
      <p className="text-sm">
        This revision is {header.stateLabel.toLowerCase()}. Figures may change before release; do not design in from this sheet.
      </p>
    </div>
  );
}

/** Part number, title, organization, revision and state, then the key facts. */
export function SheetTitleBlock({ model }: ModelProps) {
  const { header } = model;
  return (
    <header>
      <p className="running-head">Characterization sheet · {header.deviceClassLabel}</p>
      <h1 id="sheet-title" className="mt-1 text-4xl font-semibold">
        {header.partNumber}
      </h1>
      <p className="mt-1 text-xl">{header.title}</p>
      <p className="mt-2 text-ink-muted">
        {header.organizationName} · <span className="font-semibold text-ink">{header.revisionText}</span> ·{" "}
        <span className={header.released ? "" : "text-signal"}>{header.stateLabel}</span> ·{" "}
        <time dateTime={header.date} className="figure">
          {header.date}
        </time>
      </p>
      <SheetKeyFacts facts={model.keyFacts} />
    </header>
  );
}

function SheetKeyFacts({ facts }: { facts: SheetModel["keyFacts"] }) {
  if (facts.length === 0) return null;
  return (
    <dl className="mt-6 grid grid-cols-2 gap-4 border-t-[1.5px] border-ink pt-3 sm:grid-cols-4">
      {facts.map((fact) => (
        <div key={fact.label}>
          <dt className="text-sm text-ink-muted">{fact.label}</dt>
          <dd className="whitespace-nowrap text-lg">
            <span className="figure">{fact.value}</span>
            {fact.unit ? <span className="unit">{`\u00a0${fact.unit}`}</span> : null}
          </dd>
        </div>
      ))}
    </dl>
  );
}

/** The description and the key features, side by side. */
export function SheetOverview({ model }: ModelProps) {
  const { description, features } = proseLayout(model.prose);
  return (
    <div className="mt-8 grid gap-8 md:grid-cols-5">
      <section aria-labelledby="sheet-description" className="md:col-span-3">
        <SheetHeading id="sheet-description">{description?.title ?? "Description"}</SheetHeading>
        <div className="max-w-prose">{description ? <SheetProse blocks={description.blocks} /> : null}</div>
      </section>
      <section aria-labelledby="sheet-features" className="md:col-span-2">
        <SheetHeading id="sheet-features">{features?.title ?? "Key features"}</SheetHeading>
        {features ? <SheetProse blocks={features.blocks} /> : null}
      </section>
    </div>
  );
}
