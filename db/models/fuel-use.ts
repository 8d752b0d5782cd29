import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export type FuelUnit = 'cord' | 'litre';

/** Fuel burned in a run, costed at the season's price per cord or litre. */
export class FuelUse extends Model<InferAttributes<FuelUse>, InferCreationAttributes<FuelUse>> {
  declare id: CreationOptional<string>;
  declare cooperativeId: string;
  declare runId: string;
  declare kind: 'wood' | 'oil' | 'propane' | 'natural-gas' | 'pellets';
  declare quantity: number;
  declare unit: FuelUnit;
  /** Integer minor units of the co-op's currency. */
  declare costCents: number;
  declare recordedAt: CreationOptional<Date>;
  declare recordedById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    FuelUse.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        cooperativeId: { type: DataTypes.UUID, allowNull: false },
        runId: { type: DataTypes.UUID, allowNull: false },
        kind: { type: DataTypes.ENUM('wood', 'oil', 'propane', 'natural-gas', 'pellets'), allowNull: false },
        quantity: { type: DataTypes.DOUBLE, allowNull: false },
        unit: { type: DataTypes.ENUM('cord', 'litre'), allowNull: false },
        costCents: { type: DataTypes.INTEGER, allowNull: false },
        recordedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        recordedById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'fuel_uses' },
    );
  }
}
