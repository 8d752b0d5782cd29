import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export const FUEL_KINDS = ['wood', 'oil', 'propane', 'natural-gas', 'pellets'] as const;
export type FuelKind = (typeof FUEL_KINDS)[number];

/** The shared evaporator (arch, pans and firebox) that boils sap into syrup. */
export class Evaporator extends Model<InferAttributes<Evaporator>, InferCreationAttributes<Evaporator>> {
  declare id: CreationOptional<string>;
  declare cooperativeId: string;
  declare name: string;
  /** Rated evaporation in litres of water per hour. */
  declare evaporationLph: number;
  declare fuelKind: FuelKind;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Evaporator.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        cooperativeId: { type: DataTypes.UUID, allowNull: false },
        name: { type: DataTypes.TEXT, allowNull: false },
        evaporationLph: { type: DataTypes.DOUBLE, allowNull: false },
        fuelKind: { type: DataTypes.ENUM(...FUEL_KINDS), allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'evaporators' },
    );
  }
}
