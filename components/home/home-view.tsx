import Link from "next/link";
import { buttonClass } from "@/components/ui/button";
import { Quantity } from "@/components/ui/quantity";

const chain = [
  {
    step: "Bench",
    text: "Drive sweeps, output spectra, two-tone tests, Touchstone files and phase-noise traces from dozens of units, lots and temperatures, uploaded as measured.",
  },
  {
    step: "Datasheet",
    text: "Conditions, min / typ / max tables computed from the data, typical-performance curves, ratings and cautions. Every printed limit points back to the measurements behind it.",
  },
  {
    step: "Review",
    text: "A second engineer reads the draft against the last release, comments or asks for changes, and signs it off. Nobody approves their own work.",
  },
  {
    step: "Release",
    text: "An approved draft becomes a numbered revision that never changes again, as a web page and a PDF with the same typography.",
  },
  {
    step: "Customer",
    text: "Designers find the part, compare it, download the exact revision they design against, and hear by e-mail when a new one is released.",
  },
] as const;
export function HomeView({ start }: { start: { href: string; label: string } | null }) {
  return (
    <div className="space-y-20">
      <HomeIntro start={start} />
      <BenchToCustomer />
      <DeviceClassesSection />
      <WhoWorksHere />
    </div>
  );
}

/** The opening: what Benchfold is, where to start, and a line of a sheet as it prints. */
function HomeIntro({ start }: { start: { href: string; label: string } | null }) {
  return (
    <section className="grid gap-10 pt-4 lg:grid-cols-[minmax(0,1.4fr)_minmax(0,1fr)] lg:gap-16" aria-labelledby="home-title">
      <div>
        <p className="running-head mb-4">Characterization datasheets for RF conversion devices</p>
        <h1 id="home-title" className="text-[2.5rem] font-semibold leading-[1.1] sm:text-[3.25rem]">
          From the bench to a datasheet your customers can hold you to.
        </h1>
        <p className="mt-6 max-w-prose text-[1.1875rem] leading-relaxed text-ink-muted">
          Benchfold keeps the measurements, the statistics, the sheet, its review and every released revision in one place, for the makers
          of mixers, frequency multipliers and hybrids and for the labs that characterize them.
        </p>
        <div className="mt-8 flex flex-wrap items-center gap-4">
          {start ? (
            <Link href={start.href} className={buttonClass.primary}>
              Open {start.label.toLowerCase()}
            </Link>
          ) : (
            <Link href="/sign-in" className={buttonClass.primary}>
              Sign in
            </Link>
          )}
          <Link href="/catalog" className={buttonClass.secondary}>
            Browse released sheets
          </Link>
        </div>
      </div>
      <figure className="self-end border-y-[1.5px] border-ink py-5" aria-labelledby="sample-caption">
        <figcaption id="sample-caption" className="running-head mb-3">
          A line from a sheet, as Benchfold sets it
        </figcaption>
        <table className="w-full text-[0.9375rem]">
          <thead>
            <tr className="border-b border-rule-strong text-left">
              <th scope="col" className="pb-1.5 font-semibold">
                Parameter
              </th>
              <th scope="col" className="pb-1.5 text-right font-semibold">
                Min
              </th>
              <th scope="col" className="pb-1.5 text-right font-semibold">
                Typ
              </th>
              <th scope="col" className="pb-1.5 text-right font-semibold">
                Max
              </th>
              <th scope="col" className="pb-1.5 pl-3 text-left font-semibold">
                Unit
              </th>
            </tr>
          </thead>
          <tbody className="figure">
            <tr className="border-b border-rule">
              <th scope="row" className="py-1.5 text-left font-sans font-normal">
                Conversion loss
              </th>
              <td className="text-right text-ink-muted">—</td>
              <td className="text-right">10.8</td>
              <td className="text-right">12.5</td>
              <td className="pl-3 font-sans text-ink-muted">dB</td>
            </tr>
            <tr className="border-b border-rule">
              <th scope="row" className="py-1.5 text-left font-sans font-normal">
                Fundamental suppression
              </th>
              <td className="text-right">32</td>
              <td className="text-right">38</td>
              <td className="text-right text-ink-muted">—</td>
              <td className="pl-3 font-sans text-ink-muted">dBc</td>
            </tr>
            <tr>
              <th scope="row" className="py-1.5 text-left font-sans font-normal">
                Phase noise, 10 kHz
              </th>
              <td className="text-right text-ink-muted">—</td>
              <td className="text-right">−158</td>
              <td className="text-right">−152</td>
              <td className="pl-3 font-sans text-ink-muted">dBc/Hz</td>
            </tr>
          </tbody>
        </table>
        <p className="mt-3 text-sm text-ink-muted">
          Conditions: input <Quantity value="0.5–1.5" unit="GHz" />, drive <Quantity value="+13" unit="dBm" />,{" "}
          <Quantity value="25" unit="°C" />. Illustration only.
        </p>
      </figure>
    </section>
  );
}

/** The chain from bench data to the customer, step by step. */
function BenchToCustomer() {
  return (
    <section aria-labelledby="chain-title">
      <h2 id="chain-title" className="mb-6 text-2xl font-semibold">
        One chain, one direction
      </h2>
      <ol className="grid gap-0 border-t-[1.5px] border-ink md:grid-cols-5">
        {chain.map((item, index) => (
          <li key={item.step} className="border-b border-rule py-5 md:border-b-0 md:border-r md:px-5 md:first:pl-0 md:last:border-r-0">
            <p className="flex items-baseline gap-2">
              <span className="figure text-signal-deep">{String(index + 1).padStart(2, "0")}</span>
              <span className="text-lg font-semibold">{item.step}</span>
            </p>
            <p className="mt-2 text-[0.9375rem] text-ink-muted">{item.text}</p>
          </li>
        ))}
      </ol>
    </section>
  );
}

/** The device classes a sheet can describe. */
function DeviceClassesSection() {
  return (
    <section aria-labelledby="classes-title">
      <h2 id="classes-title" className="mb-2 text-2xl font-semibold">
        Three device classes to begin with
      </h2>
      <p className="mb-6 max-w-prose text-ink-muted">
        Each class is a template: which measurements it takes, what it derives from them, and which tables and curves its sheet shows.
      </p>
      <table className="sheet-table">
        <thead>
          <tr>
            <th scope="col" className="w-[16rem]">
              Class
            </th>
            <th scope="col">What its sheet computes</th>
          </tr>
        </thead>
        <tbody>
          <tr>
            <th scope="row" className="font-semibold">
              Frequency multiplier
              <span className="block text-sm font-normal text-ink-muted">including a mixer driven as a doubler</span>
            </th>
            <td>
              Conversion loss against drive and frequency, the optimum drive, suppression of the fundamental and of the 3rd and 4th
              harmonics in <span className="unit">dBc</span>, phase noise at decade offsets (residual or absolute) and its excess over the ideal{" "}
              <span className="figure">20·log₁₀(N)</span>, noise floor against <Quantity value="−174" unit="dBm/Hz" /> at{" "}
              <Quantity value="290" unit="K" />, discrete spurs.
            </td>
          </tr>
          <tr>
            <th scope="row" className="font-semibold">
              Double-balanced mixer
            </th>
            <td>
              Conversion loss across RF frequency at the LO drive class, LO–RF, LO–IF and RF–IF isolation, input P1dB, IIP3 from two-tone
              data, port VSWR and return loss.
            </td>
          </tr>
          <tr>
            <th scope="row" className="font-semibold">
              Quadrature hybrid or power splitter
            </th>
            <td>Insertion loss, amplitude and phase balance, isolation and VSWR, from 3- and 4-port Touchstone files.</td>
          </tr>
        </tbody>
      </table>
    </section>
  );
}

/** Who works in Benchfold and what each role does. */
function WhoWorksHere() {
  return (
    <section aria-labelledby="who-title" className="grid gap-8 md:grid-cols-3">
      <h2 id="who-title" className="sr-only">
        Who works in Benchfold
      </h2>
      <div className="border-t border-rule pt-4">
        <h3 className="font-semibold">Component makers and test labs</h3>
        <p className="mt-2 text-[0.9375rem] text-ink-muted">
          Engineers build sheets from their data, reviewers sign them off, administrators manage people and roles. Drafts and uploads stay
          inside the organization.
        </p>
      </div>
      <div className="border-t border-rule pt-4">
        <h3 className="font-semibold">Designers who use the parts</h3>
        <p className="mt-2 text-[0.9375rem] text-ink-muted">
          Released sheets are public. A customer account adds change notices for the parts you follow.
        </p>
      </div>
      <div className="border-t border-rule pt-4">
        <h3 className="font-semibold">Anyone holding a printout</h3>
        <p className="mt-2 text-[0.9375rem] text-ink-muted">
          Every released revision is fixed and numbered, so a PDF on a desk can be matched to the exact release it came from.
        </p>
      </div>
    </section>
  );
}
