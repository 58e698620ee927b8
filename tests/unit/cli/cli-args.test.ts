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
