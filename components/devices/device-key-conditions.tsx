import type { DeviceSummary } from "@/lib/domain/devices";
import { formatNumber } from "@/lib/format";
import { NumberQuantity, RangeQuantity } from "@/components/ui/quantity";
import { deviceClassLabels } from "@/lib/domain/device-classes";
import { TermGrid } from "@/components/ui/term-grid";
import { keyConditionField } from "@/lib/domain/measurement-conditions";
import { classConditions } from "@/templates/upload-conditions";

/** The identifying conditions of a part, as a ruled definition list. */
export function DeviceKeyConditions({ device }: { device: DeviceSummary }) {
  const k = device.keyConditions;
  const items: [string, React.ReactNode][] = [
    ["Class", deviceClassLabels[device.deviceClass]],
    ...(k.multiplicationFactor ? ([["Multiplication", <span key="f" className="figure">×{formatNumber(k.multiplicationFactor)}</span>]] as [string, React.ReactNode][]) : []),
    ["Input range", k.inputFrequencyHz ? <RangeQuantity key="i" {...k.inputFrequencyHz} unit="Hz" /> : "—"],
    ["Output range", k.outputFrequencyHz ? <RangeQuantity key="o" {...k.outputFrequencyHz} unit="Hz" /> : "—"],
    [keyConditionField(classConditions[device.deviceClass], "drive").label, k.driveLevelDbm === undefined ? "—" : <NumberQuantity key="d" value={k.driveLevelDbm} unit="dBm" signed />],
  ];
  return (
    <TermGrid items={items} columns="sm:grid-cols-3 lg:grid-cols-5" testId="device-key-conditions" />
  );
}
