import { describe, expect, it } from "vitest";
import { readReplicaHosts } from "@/models/connection";

describe("readReplicaHosts (DB_REPLICA_HOSTS)", () => {
  it("is empty when unset or blank: public reads stay on the primary", () => {
    expect(readReplicaHosts({})).toEqual([]);
    expect(readReplicaHosts({ DB_REPLICA_HOSTS: " , " })).toEqual([]);
  });

  it("reads host:port pairs, a bare host as port 3306 (MariaDB's), and a bracketed IPv6 address", () => {
    expect(readReplicaHosts({ DB_REPLICA_HOSTS: "replica-1:3307, replica-2 ,[::1]:3417" })).toEqual([
      { host: "replica-1", port: 3307 },
      { host: "replica-2", port: 3306 },
      { host: "::1", port: 3417 },
    ]);
  });

  it("refuses an entry it cannot read, naming it", () => {
    expect(() => readReplicaHosts({ DB_REPLICA_HOSTS: "replica-1:99999" })).toThrow(/"replica-1:99999"/);
    expect(() => readReplicaHosts({ DB_REPLICA_HOSTS: "replica-1:abc" })).toThrow(/DB_REPLICA_HOSTS/);
  });
});
