import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export type UnitSystem = 'metric' | 'us';

/** A cooperative sugarhouse: the tenant every other row belongs to. */
export class Cooperative extends Model<InferAttributes<Cooperative>, InferCreationAttributes<Cooperative>> {
  declare id: CreationOptional<string>;
  declare name: string;
  /** IANA time zone the sugarhouse keeps its clock in, e.g. America/New_York. */
  declare timeZone: string;
  /** Elevation of the sugarhouse in metres, for the draw-off temperature. */
  declare elevationM: number;
  /** Units shown to people; the database always stores SI. */
  declare unitSystem: CreationOptional<UnitSystem>;
  /** ISO 4217 code; all money is integer minor units of it. */
  declare currency: string;
  /** Sugarhouse hours ('HH:MM:SS', local time) inside which members may book. */
  declare opensAt: CreationOptional<string>;
  declare closesAt: CreationOptional<string>;
  declare slotMinMinutes: CreationOptional<number>;
  declare slotMaxMinutes: CreationOptional<number>;
  /** How many hours before its start a member may still cancel a slot. */
  declare cancelNoticeHours: CreationOptional<number>;
  /** °Brix the co-op finishes syrup to. */
  declare syrupBrix: CreationOptional<number>;
  declare shelfDays: CreationOptional<number>;
  declare warmAboveC: CreationOptional<number>;
  declare warmShelfDays: CreationOptional<number>;
  /** Grows by one with every change the live screens show (lib/events); bigint, read as a string. */
  declare changeVersion: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Cooperative.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        name: { type: DataTypes.TEXT, allowNull: false },
        timeZone: { type: DataTypes.TEXT, allowNull: false },
        elevationM: { type: DataTypes.DOUBLE, allowNull: false },
        unitSystem: { type: DataTypes.ENUM('metric', 'us'), allowNull: false, defaultValue: 'metric' },
        currency: { type: DataTypes.CHAR(3), allowNull: false },
        opensAt: { type: DataTypes.TIME, allowNull: false, defaultValue: '06:00:00' },
        closesAt: { type: DataTypes.TIME, allowNull: false, defaultValue: '22:00:00' },
        slotMinMinutes: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 60 },
        slotMaxMinutes: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 720 },
        cancelNoticeHours: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 12 },
        syrupBrix: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 66.9 },
        shelfDays: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 7 },
        warmAboveC: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 7 },
        warmShelfDays: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 3 },
        changeVersion: { type: DataTypes.BIGINT, allowNull: false, defaultValue: '0' },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'cooperatives' },
    );
  }
}
