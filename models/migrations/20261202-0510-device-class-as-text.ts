import { DataTypes, type QueryInterface } from "sequelize";

/**
 * devices.device_class from ENUM to VARCHAR: a new device class is a template folder plus one
 * line in lib/domain/device-classes.ts, with no migration per class. The device model checks
 * the name against that list (and the device schema refuses an unknown one with 422).
 * MariaDB keeps each row's text when an ENUM column becomes VARCHAR.
 */
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.changeColumn("devices", "device_class", { type: DataTypes.STRING(64), allowNull: false });
}

/** Back to the ENUM of 2026-12-01 (values copied, not imported); fails while a row holds a later class. */
export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.changeColumn("devices", "device_class", {
    type: DataTypes.ENUM("frequency-multiplier", "double-balanced-mixer", "quadrature-hybrid"),
    allowNull: false,
  });
}
