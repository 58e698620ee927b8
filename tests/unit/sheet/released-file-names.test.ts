import { describe, expect, it } from "vitest";
import { formatTemperature } from "@/lib/sheet/format";
import { attachmentDisposition, specificationsCsvFileName, touchstoneFileNames } from "@/lib/sheet/file-name";

describe("names of a released revision's files", () => {
  it("names a Touchstone file by part, revision, serial and temperature, with its port count", () => {
    const names = touchstoneFileNames({
      partNumber: "KQH-2G",
      letter: "A",
      sets: [
                // The temperature as the frozen model's traceability prints it (a space before "°C", a true minus).
        { setId: "11", serial: "BFD-0301", temperature: formatTemperature(25), portCount: 4 },
        { setId: "12", serial: "BFD-0301", temperature: formatTemperature(-40), portCount: 4 },
        { setId: "13", serial: "BFD 03/02", temperature: "", portCount: 2 },
      ],
    });
    expect(names.get("11")).toBe("KQH-2G_revA_BFD-0301_25C.s4p");
    expect(names.get("12")).toBe("KQH-2G_revA_BFD-0301_-40C.s4p");
    expect(names.get("13")).toBe("KQH-2G_revA_BFD_03_02_nominal.s2p");
  });

  it("adds the set id when two sets would share a name", () => {
    const names = touchstoneFileNames({
      partNumber: "KM/7H",
      letter: "B",
      sets: [
        { setId: "4", serial: "U1", temperature: "25°C", portCount: 2 },
        { setId: "5", serial: "U1", temperature: "25°C", portCount: 2 },
      ],
    });
    expect([...names.values()]).toEqual(["KM_7H_revB_U1_25C_set4.s2p", "KM_7H_revB_U1_25C_set5.s2p"]);
  });

  it("never lets a name leave the safe characters", () => {
    const names = touchstoneFileNames({ partNumber: '../"x";\r\n', letter: "A", sets: [{ setId: "1", serial: "..", temperature: "", portCount: 2 }] });
    expect(names.get("1")).toMatch(/^[A-Za-z0-9._-]+$/);
    expect(names.get("1")).not.toContain("..");
    expect(specificationsCsvFileName("KDX-2G4", "B")).toBe("KDX-2G4-rev-B-specifications.csv");
  });

  it("gives an uploaded name with other characters as RFC 8187 filename* beside an ASCII fallback", () => {
    expect(attachmentDisposition("hybrid-4port.s4p")).toBe('attachment; filename="hybrid-4port.s4p"');
    const d = attachmentDisposition('Messung "Ü" 25°C.s2p');
    expect(d).toBe(`attachment; filename="Messung_25_C.s2p"; filename*=UTF-8''Messung%20%22%C3%9C%22%2025%C2%B0C.s2p`);
    expect(decodeURIComponent(d.split("''")[1])).toBe('Messung "Ü" 25°C.s2p');
  });
});
