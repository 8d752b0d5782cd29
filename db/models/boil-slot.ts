import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export type BoilSlotStatus = 'booked' | 'cancelled' | 'done';

/** A household's booking of the evaporator to crew a boil; stored in UTC. */
export class BoilSlot extends Model<InferAttributes<BoilSlot>, InferCreationAttributes<BoilSlot>> {
  declare id: CreationOptional<string>;
  declare cooperativeId: string;
  declare seasonId: string;
  declare evaporatorId: string;
  /** The household that crews the boil. */
  declare householdId: string;
  declare startsAt: Date;
  declare endsAt: Date;
  /** Names of the people tending the fire. */
  declare crew: CreationOptional<string[]>;
  declare expectedSapL: number | null;
  declare note: string | null;
  declare status: CreationOptional<BoilSlotStatus>;
  declare bookedById: string | null;
  declare cancelledAt: CreationOptional<Date | null>;
  declare cancelledById: CreationOptional<string | null>;
  /** 0 when booked, one more with every change (a database trigger raises it); the .ics SEQUENCE. */
  declare revision: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    BoilSlot.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        cooperativeId: { type: DataTypes.UUID, allowNull: false },
        seasonId: { type: DataTypes.UUID, allowNull: false },
        evaporatorId: { type: DataTypes.UUID, allowNull: false },
        householdId: { type: DataTypes.UUID, allowNull: false },
        startsAt: { type: DataTypes.DATE, allowNull: false },
        endsAt: { type: DataTypes.DATE, allowNull: false },
        crew: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false, defaultValue: [] },
        expectedSapL: { type: DataTypes.DOUBLE, allowNull: true },
        note: { type: DataTypes.TEXT, allowNull: true },
        status: { type: DataTypes.ENUM('booked', 'cancelled', 'done'), allowNull: false, defaultValue: 'booked' },
        bookedById: { type: DataTypes.UUID, allowNull: true },
        cancelledAt: { type: DataTypes.DATE, allowNull: true },
        cancelledById: { type: DataTypes.UUID, allowNull: true },
        revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'boil_slots' },
    );
  }
}
