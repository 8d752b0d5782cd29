import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export type BoilRunStatus = 'running' | 'finished';

/** One firing of an evaporator: the sap taken in, the syrup drawn off, the fuel burned. */
export class BoilRun extends Model<InferAttributes<BoilRun>, InferCreationAttributes<BoilRun>> {
  declare id: CreationOptional<string>;
  declare cooperativeId: string;
  declare seasonId: string;
  declare evaporatorId: string;
  /** The booked slot it runs in, when it runs inside one. */
  declare slotId: string | null;
  /** 1, 2, 3 … within the season. */
  declare runNumber: number;
  /** Traceability code printed on the syrup: season year and run number, e.g. "2027-014". */
  declare lotCode: string;
  declare status: CreationOptional<BoilRunStatus>;
  declare startedAt: Date;
  declare finishedAt: CreationOptional<Date | null>;
  declare startedById: string | null;
  declare finishedById: CreationOptional<string | null>;
  declare note: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    BoilRun.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        cooperativeId: { type: DataTypes.UUID, allowNull: false },
        seasonId: { type: DataTypes.UUID, allowNull: false },
        evaporatorId: { type: DataTypes.UUID, allowNull: false },
        slotId: { type: DataTypes.UUID, allowNull: true },
        runNumber: { type: DataTypes.INTEGER, allowNull: false },
        lotCode: { type: DataTypes.TEXT, allowNull: false },
        status: { type: DataTypes.ENUM('running', 'finished'), allowNull: false, defaultValue: 'running' },
        startedAt: { type: DataTypes.DATE, allowNull: false },
        finishedAt: { type: DataTypes.DATE, allowNull: true },
        startedById: { type: DataTypes.UUID, allowNull: true },
        finishedById: { type: DataTypes.UUID, allowNull: true },
        note: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'boil_runs' },
    );
  }
}
