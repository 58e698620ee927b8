/**
 * The invented demo scenario: one independent RF test lab, two component vendors and
 * one customer. Every name is made up; e-mail domains use the reserved `.example` TLD.
 */
import type { DeviceClass, KeyConditions } from "../device";
import type { OrganizationKind } from "../organization";
import type { UserRole } from "../user";

export const demoPassword = "bench-demo-2026";

type DemoUser = { name: string; email: string; role: UserRole };
type DemoDevice = { partNumber: string; deviceClass: DeviceClass; title: string; description: string; keyConditions: KeyConditions };
type DemoOrganization = { slug: string; name: string; kind: OrganizationKind; users: DemoUser[]; devices: DemoDevice[] };

const GHz = 1e9;
const MHz = 1e6;

export const demoOrganizations: DemoOrganization[] = [
  {
    slug: "wrenfield-lab",
    name: "Wrenfield RF Test Laboratory",
    kind: "lab",
    users: [
      { name: "Mira Okafor", email: "mira.okafor@wrenfield-lab.example", role: "admin" },
      { name: "Tomas Lindqvist", email: "tomas.lindqvist@wrenfield-lab.example", role: "engineer" },
      { name: "Priya Raman", email: "priya.raman@wrenfield-lab.example", role: "reviewer" },
    ],
    devices: [
      {
        partNumber: "WL-C2611-KDX",
        deviceClass: "frequency-multiplier",
        title: "Independent characterization: mixer-based ×2 multiplier, lot 2611",
        description: "Third-party characterization of a double-balanced mixer driven on both ports as a frequency doubler.",
        keyConditions: { inputFrequencyHz: { min: 0.5 * GHz, max: 1.5 * GHz }, outputFrequencyHz: { min: 1 * GHz, max: 3 * GHz }, driveLevelDbm: 10, multiplicationFactor: 2 },
      },
      {
        partNumber: "WL-C2614-PM13",
        deviceClass: "double-balanced-mixer",
        title: "Independent characterization: +13 dBm LO double-balanced mixer",
        description: "Conversion loss, isolation and intercept across three lots.",
        keyConditions: { inputFrequencyHz: { min: 10 * MHz, max: 3 * GHz }, driveLevelDbm: 13 },
      },
    ],
  },
  {
    slug: "kestrine",
    name: "Kestrine Microwave",
    kind: "vendor",
    users: [
      { name: "Jonas Afolabi", email: "jonas.afolabi@kestrine.example", role: "admin" },
      { name: "Elena Marchetti", email: "elena.marchetti@kestrine.example", role: "engineer" },
      { name: "Hiroshi Tanabe", email: "hiroshi.tanabe@kestrine.example", role: "reviewer" },
    ],
    devices: [
      {
        partNumber: "KDX-2G4",
        deviceClass: "frequency-multiplier",
        title: "Passive ×2 frequency multiplier, 1.0–2.4 GHz output",
        description: "Schottky-diode ring doubler with integral input balun.",
        keyConditions: { inputFrequencyHz: { min: 0.5 * GHz, max: 1.2 * GHz }, outputFrequencyHz: { min: 1 * GHz, max: 2.4 * GHz }, driveLevelDbm: 10, multiplicationFactor: 2 },
      },
      {
        partNumber: "KM-7H",
        deviceClass: "double-balanced-mixer",
        title: "Double-balanced mixer, +7 dBm LO, 0.5–3 GHz",
        description: "Level 7 passive mixer for general frequency conversion.",
        keyConditions: { inputFrequencyHz: { min: 0.5 * GHz, max: 3 * GHz }, driveLevelDbm: 7 },
      },
      {
        partNumber: "KQH-2G",
        deviceClass: "quadrature-hybrid",
        title: "90° hybrid coupler, 1.7–2.3 GHz",
        description: "Surface-mount quadrature hybrid for balanced amplifiers and image-reject mixers.",
        keyConditions: { inputFrequencyHz: { min: 1.7 * GHz, max: 2.3 * GHz } },
      },
    ],
  },
  {
    slug: "pellacourt",
    name: "Pellacourt Components",
    kind: "vendor",
    users: [
      { name: "Sofia Brandt", email: "sofia.brandt@pellacourt.example", role: "admin" },
      { name: "Kwame Mensah", email: "kwame.mensah@pellacourt.example", role: "engineer" },
      { name: "Lucía Ferreyra", email: "lucia.ferreyra@pellacourt.example", role: "reviewer" },
    ],
    devices: [
      {
        partNumber: "PX-40",
        deviceClass: "frequency-multiplier",
        title: "×2 multiplier, 2–4 GHz output, +14 dBm per port",
        description: "High-drive diode doubler for local-oscillator chains.",
        keyConditions: { inputFrequencyHz: { min: 1 * GHz, max: 2 * GHz }, outputFrequencyHz: { min: 2 * GHz, max: 4 * GHz }, driveLevelDbm: 14, multiplicationFactor: 2 },
      },
      {
        partNumber: "PM-13",
        deviceClass: "double-balanced-mixer",
        title: "Double-balanced mixer, +13 dBm LO, 10–3000 MHz",
        description: "Level 13 mixer with improved intercept.",
        keyConditions: { inputFrequencyHz: { min: 10 * MHz, max: 3 * GHz }, driveLevelDbm: 13 },
      },
      {
        partNumber: "PS-2W",
        deviceClass: "quadrature-hybrid",
        title: "Two-way 0° power splitter, 0.5–3 GHz",
        description: "Resistive-reactive in-phase splitter for LO distribution.",
        keyConditions: { inputFrequencyHz: { min: 0.5 * GHz, max: 3 * GHz } },
      },
    ],
  },
  {
    slug: "tarnby-radio",
    name: "Tarnby Radio Systems",
    kind: "customer",
    users: [{ name: "Anneli Vos", email: "anneli.vos@tarnby-radio.example", role: "customer" }],
    devices: [],
  },
];
