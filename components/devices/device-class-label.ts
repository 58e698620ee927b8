export { deviceClassLabels } from "@/lib/devices/class-labels";
