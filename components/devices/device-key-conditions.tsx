import type { DeviceSummary } from "@/lib/domain/devices";
import { formatFrequencyRange, formatNumber } from "@/components/format-quantity";
import { Quantity } from "@/components/ui/quantity";
import { deviceClassLabels } from "@/lib/domain/device-classes";

/** The identifying conditions of a part, as a ruled definition list. */
export function DeviceKeyConditions({ device }: { device: DeviceSummary }) {
  const k = device.keyConditions;
  const items: [string, React.ReactNode][] = [
    ["Class", deviceClassLabels[device.deviceClass]],
    ...(k.multiplicationFactor ? ([["Multiplication", <span key="f" className="figure">×{formatNumber(k.multiplicationFactor)}</span>]] as [string, React.ReactNode][]) : []),
    ["Input range", k.inputFrequencyHz ? <Quantity key="i" {...formatFrequencyRange(k.inputFrequencyHz)} /> : "—"],
    ["Output range", k.outputFrequencyHz ? <Quantity key="o" {...formatFrequencyRange(k.outputFrequencyHz)} /> : "—"],
    ["Drive level", k.driveLevelDbm === undefined ? "—" : <Quantity key="d" value={formatNumber(k.driveLevelDbm, { signed: true })} unit="dBm" />],
  ];
  return (
    <dl className="grid grid-cols-2 gap-x-8 gap-y-3 border-y border-rule py-4 sm:grid-cols-3 lg:grid-cols-5" data-testid="device-key-conditions">
      {items.map(([term, value]) => (
        <div key={term}>
          <dt className="running-head">{term}</dt>
          <dd className="mt-0.5">{value}</dd>
        </div>
      ))}
    </dl>
  );
}
