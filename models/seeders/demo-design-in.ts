/**
 * What the demo engineers state for a designer on the released parts' sheets: pin functions,
 * ordering information, recommended operating conditions and the package outline (an SVG drawn for
 * the demo, in outlines/, uploaded through the outline endpoint and rasterised there). Invented:
 * the packages, order codes and packing are the demo's own. The conditions stay inside each sheet's
 * absolute maximum ratings (demo-sheets.ts) and beside the conditions its rows are stated at.
 * Saved by scripts/seed-demo-measurements.ts before any release, so every released revision carries them.
 */
import { readFileSync } from "node:fs";
import path from "node:path";
import type { DesignDataBody } from "../../lib/schemas/sheets";

export interface DemoDesignIn extends Required<Pick<DesignDataBody, "pinFunctions" | "ordering" | "recommendedOperatingConditions">> {
  packageOutline: { file: string; caption: string };
}

const condition = (parameter: string, min: string, typ: string, max: string, unit: string) => ({ parameter, min, typ, max, unit });
const ground = (pins: string) => ({ pin: pins, name: "GND", function: "Ground; give each pin its own via to the ground plane" });

/** The file next to this module: its bytes are what the loader uploads and the unit tests rasterise. */
export const demoOutlineBytes = (file: string): Buffer => readFileSync(path.join(process.cwd(), "models", "seeders", "outlines", file));

const kl6 = (part: string) => ({
  file: "kl6-3x3.svg",
  caption: `${part} in the KL6 package: 6 leads, 3.00 × 3.00 mm body, 0.95 mm lead pitch, 1.10 mm high at most. Dimensions in mm.`,
});

export const demoDesignIn: Record<string, DemoDesignIn> = {
  "KM-7H": {
    pinFunctions: [
      { pin: "1", name: "LO", function: "Local-oscillator input, 50 Ω, DC-coupled to the diode ring" },
      ground("2, 5"),
      { pin: "3", name: "RF", function: "RF input, 50 Ω" },
      { pin: "4", name: "IF", function: "IF output, DC-coupled; a DC return is inside the part" },
      { pin: "6", name: "NC", function: "Not connected inside; may be grounded" },
    ],
    ordering: [
      { partNumber: "KM-7H-TR1", options: "Lead-free matte-tin finish", packing: "Tape and reel, 1000 per 178 mm reel" },
      { partNumber: "KM-7H-CT", options: "Lead-free matte-tin finish", packing: "Cut tape, 25 pieces" },
      { partNumber: "KM-7H-EB", options: "Evaluation board with SMA connectors on RF, LO and IF", packing: "Single board, anti-static bag" },
    ],
    recommendedOperatingConditions: [
      condition("LO drive", "5", "7", "10", "dBm"),
      condition("RF input power", "", "−10", "−5", "dBm"),
      condition("RF frequency", "500", "", "3000", "MHz"),
      condition("IF frequency", "", "70", "1000", "MHz"),
      condition("Ambient temperature", "−40", "", "85", "°C"),
    ],
    packageOutline: kl6("KM-7H"),
  },
  "KDX-2G4": {
    pinFunctions: [
      { pin: "1", name: "IN A", function: "Input (fundamental), 50 Ω: one output of an in-phase splitter" },
      ground("2, 5"),
      { pin: "3", name: "IN B", function: "Input (fundamental), 50 Ω: the splitter's other output, equal phase and level" },
      { pin: "4", name: "OUT", function: "Output (twice the input frequency), 50 Ω, DC-coupled" },
      { pin: "6", name: "NC", function: "Not connected inside; may be grounded" },
    ],
    ordering: [
      { partNumber: "KDX-2G4-TR1", options: "Lead-free matte-tin finish", packing: "Tape and reel, 1000 per 178 mm reel" },
      { partNumber: "KDX-2G4-CT", options: "Lead-free matte-tin finish", packing: "Cut tape, 25 pieces" },
      { partNumber: "KDX-2G4-EB", options: "Evaluation board with the in-phase splitter fitted", packing: "Single board, anti-static bag" },
    ],
    recommendedOperatingConditions: [
      condition("Input drive, per port", "9", "10.8", "13", "dBm"),
      condition("Input frequency", "500", "", "1200", "MHz"),
      condition("Ambient temperature", "−40", "", "85", "°C"),
    ],
    packageOutline: kl6("KDX-2G4"),
  },
  "KQH-2G": {
    pinFunctions: [
      { pin: "1", name: "IN", function: "Input, 50 Ω" },
      { pin: "2", name: "0°", function: "Through output, 50 Ω" },
      { pin: "3", name: "−90°", function: "Coupled output, 50 Ω" },
      { pin: "4", name: "ISO", function: "Isolated port; terminate in 50 Ω rated for the reflected power" },
      { pin: "Paddle", name: "GND", function: "Ground; solder the whole paddle, with vias under it" },
    ],
    ordering: [
      { partNumber: "KQH-2G-TR5", options: "Gold over nickel pads", packing: "Tape and reel, 500 per 178 mm reel" },
      { partNumber: "KQH-2G-CT", options: "Gold over nickel pads", packing: "Cut tape, 10 pieces" },
    ],
    recommendedOperatingConditions: [
      condition("Frequency", "1700", "", "2300", "MHz"),
      condition("Input power, CW", "", "", "10", "W"),
      condition("Ambient temperature", "−55", "", "85", "°C"),
    ],
    packageOutline: {
      file: "kq4-5x4.svg",
      caption: "KQH-2G in the KQ4 package: 4 pads and a ground paddle, 5.00 × 4.00 mm body, 1.60 mm high at most. Dimensions in mm.",
    },
  },
};
