import { describe, expect, it } from "vitest";
import { parseCliArgs } from "@/lib/analysis";

describe("benchfold CLI arguments", () => {
  it.each([
    [["analyze", "a.csv"], { command: "analyze", file: "a.csv", kind: undefined, json: false }],
    [["analyze", "a.csv", "--json"], { command: "analyze", file: "a.csv", kind: undefined, json: true }],
    [["analyze", "--kind", "two-tone", "a.tsv"], { command: "analyze", file: "a.tsv", kind: "two-tone", json: false }],
    [["analyze", "a.txt", "--kind=touchstone", "--json"], { command: "analyze", file: "a.txt", kind: "touchstone", json: true }],
    [["--help"], { command: "help" }],
    [["analyze", "a.csv", "-h"], { command: "help" }],
    [["help"], { command: "help" }],
  ])("%j", (argv, expected) => {
    expect(parseCliArgs(argv)).toEqual(expected);
  });

  it.each([
    [[], "No command"],
    [["analyse", "a.csv"], 'Unknown command "analyse"'],
    [["analyze"], "needs a file"],
    [["analyze", "a.csv", "--jsn"], 'Unknown option "--jsn"'],
    [["analyze", "a.csv", "--kind"], "--kind needs a value"],
    [["analyze", "a.csv", "--kind", "noise"], 'Unknown kind "noise"'],
    [["analyze", "a.csv", "b.csv"], "Only one file"],
  ])("%j is refused", (argv, message) => {
    const result = parseCliArgs(argv);
    expect(result.command).toBe("error");
    expect(result.command === "error" && result.message).toContain(message);
  });
});

describe("benchfold CLI settings", () => {
  it.each([
    [["analyze", "a.csv", "--integration", "12e3:20e6"], { integrationBandHz: { startHz: 12e3, stopHz: 20e6 } }],
    [["analyze", "a.csv", "--integration=10-1m"], { integrationBandHz: { startHz: 10, stopHz: 1e6 } }],
    [["analyze", "a.csv", "--compression-reference", "-20"], { compressionReferenceDbm: -20 }],
    [["analyze", "a.csv", "--compression-reference=-7.5"], { compressionReferenceDbm: -7.5 }],
  ])("%j", (argv, settings) => {
    expect(parseCliArgs(argv)).toMatchObject({ command: "analyze", file: "a.csv", settings });
  });

  it("--class and --impedance", () => {
    expect(parseCliArgs(["analyze", "a.csv", "--class", "frequency-multiplier", "--impedance", "75"])).toMatchObject({ deviceClass: "frequency-multiplier", settings: { impedanceOhm: 75 } });
  });

  it("--resolution-bandwidth and --noise-bandwidth: the phase-noise trace's bandwidth for spurs in dBc", () => {
    expect(parseCliArgs(["analyze", "a.csv", "--resolution-bandwidth", "1e3"])).toMatchObject({ settings: { spurBandwidth: { kind: "resolution", hz: 1000 } } });
    expect(parseCliArgs(["analyze", "a.csv", "--noise-bandwidth=0.5"])).toMatchObject({ settings: { spurBandwidth: { kind: "noise", hz: 0.5 } } });
  });

  it.each([
    [["analyze", "a.csv", "--resolution-bandwidth", "1e3", "--noise-bandwidth", "1e3"], "State --resolution-bandwidth or --noise-bandwidth, once"],
    [["analyze", "a.csv", "--noise-bandwidth", "0"], "--noise-bandwidth needs a bandwidth in Hz"],
    [["analyze", "a.csv", "--resolution-bandwidth", "wide"], "--resolution-bandwidth needs a bandwidth in Hz"],
    [["analyze", "a.csv", "--integration", "20e6:12e3"], "0 < start < stop"],
    [["analyze", "a.csv", "--integration", "12k"], "--integration needs <start>:<stop>"],
    [["analyze", "a.csv", "--integration", "0x10:1e6"], "--integration needs <start>:<stop>"],
    [["analyze", "a.csv", "--compression-reference", "loud"], "--compression-reference needs a drive"],
    [["analyze", "a.csv", "--class", "amplifier"], 'Unknown device class "amplifier"'],
    [["analyze", "a.csv", "--impedance", "-50"], "--impedance needs a resistance"],
  ])("%j is refused", (argv, message) => {
    const result = parseCliArgs(argv);
    expect(result.command === "error" && result.message).toContain(message);
  });
});
