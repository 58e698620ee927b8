import { describe, expect, it } from "vitest";
import { checkDeviceForm, initialDeviceFormValues, rangeValue, readRange, type DeviceFormValues } from "@/components/devices/device-form-values";

const filled: DeviceFormValues = {
  partNumber: "KX-1",
  deviceClass: "frequency-multiplier",
  title: "Frequency tripler",
  description: "",
  input: { min: "0.2", max: "2.4", unit: "GHz" },
  output: { min: "", max: "", unit: "GHz" },
  drive: "−3",
  factor: "3",
};

describe("device form values", () => {
  it("offers a stored range in the unit the pages print it in, exactly", () => {
    // 2.4 GHz in floating point is 2400000000.0000005 when scaled naively; twelve significant figures give it back.
    expect(rangeValue({ min: 2e8, max: 2.4e9 })).toEqual({ min: "0.2", max: "2.4", unit: "GHz" });
    expect(rangeValue({ min: 1e6, max: 3e6 })).toEqual({ min: "1", max: "3", unit: "MHz" });
    expect(rangeValue(undefined)).toEqual({ min: "", max: "", unit: "GHz" });
  });

  it("reads a range as both ends or neither, rising, above zero", () => {
    expect(readRange({ min: "", max: "", unit: "GHz" }, "input range")).toEqual({});
    expect(readRange({ min: "1", max: "2.4", unit: "GHz" }, "input range")).toEqual({ range: { min: 1e9, max: 2.4e9 } });
    expect(readRange({ min: "1", max: "", unit: "GHz" }, "input range").error).toBe("Give both ends of the input range, or neither.");
    expect(readRange({ min: "a", max: "2", unit: "GHz" }, "input range").error).toBe("The input range must be numbers.");
    expect(readRange({ min: "0", max: "2", unit: "MHz" }, "output range").error).toBe("The output range must be above 0 MHz.");
    expect(readRange({ min: "3", max: "2", unit: "GHz" }, "input range").error).toBe("The input range must run from the lower to the higher frequency.");
  });

  it("starts from the device when editing, else empty with a factor of 2", () => {
    expect(initialDeviceFormValues(undefined)).toMatchObject({ partNumber: "", drive: "", factor: "2" });
    const device = {
      id: 1,
      partNumber: "KX-1",
      deviceClass: "frequency-multiplier" as const,
      title: "T",
      description: "D",
      keyConditions: { inputFrequencyHz: { min: 2e8, max: 2.4e9 }, driveLevelDbm: -3, multiplicationFactor: 3 },
      updatedAt: "",
    };
    expect(initialDeviceFormValues(device)).toEqual({ ...filled, title: "T", description: "D", drive: "-3" });
  });

  it("builds the body, sending the factor for a multiplier only", () => {
    expect(checkDeviceForm(filled)).toEqual({
      body: {
        partNumber: "KX-1",
        deviceClass: "frequency-multiplier",
        title: "Frequency tripler",
        description: "",
        keyConditions: { inputFrequencyHz: { min: 2e8, max: 2.4e9 }, driveLevelDbm: -3, multiplicationFactor: 3 },
      },
    });
    const mixer = checkDeviceForm({ ...filled, deviceClass: "double-balanced-mixer" });
    expect(mixer.body?.keyConditions).toEqual({ inputFrequencyHz: { min: 2e8, max: 2.4e9 }, driveLevelDbm: -3 });
  });

  it("names every field that is wrong, the form's own words before the schema's", () => {
    const result = checkDeviceForm({ ...filled, partNumber: "", input: { min: "2", max: "", unit: "GHz" }, drive: "loud", factor: "1" });
    expect(result.body).toBeUndefined();
    expect(result.errors).toMatchObject({
      inputFrequencyHz: "Give both ends of the input range, or neither.",
      driveLevelDbm: "The drive level must be a number in dBm.",
    });
    expect(Object.keys(result.errors ?? {}).sort()).toEqual(["driveLevelDbm", "inputFrequencyHz", "multiplicationFactor", "partNumber"]);
  });
});
