import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export type SeasonStatus = 'planned' | 'open' | 'closed' | 'settled';

/** One sap season of a cooperative; at most one is open at a time. */
export class Season extends Model<InferAttributes<Season>, InferCreationAttributes<Season>> {
  declare id: CreationOptional<string>;
  declare cooperativeId: string;
  declare label: string;
  /** First and last day (YYYY-MM-DD, the co-op's calendar) of the season. */
  declare startsOn: string;
  declare endsOn: string;
  declare status: CreationOptional<SeasonStatus>;
  /** Price of one unit of the evaporator's fuel (a cord, a litre) in minor currency units. */
  declare fuelPriceCents: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Season.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        cooperativeId: { type: DataTypes.UUID, allowNull: false },
        label: { type: DataTypes.TEXT, allowNull: false },
        startsOn: { type: DataTypes.DATEONLY, allowNull: false },
        endsOn: { type: DataTypes.DATEONLY, allowNull: false },
        status: { type: DataTypes.ENUM('planned', 'open', 'closed', 'settled'), allowNull: false, defaultValue: 'planned' },
        fuelPriceCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'seasons' },
    );
  }
}
