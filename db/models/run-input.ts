import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** Litres of one lot taken into one run; a lot may be split over runs, never over-drawn (see the migration). */
export class RunInput extends Model<InferAttributes<RunInput>, InferCreationAttributes<RunInput>> {
  declare id: CreationOptional<string>;
  declare cooperativeId: string;
  declare runId: string;
  declare deliveryId: string;
  declare litres: number;
  declare takenAt: CreationOptional<Date>;
  declare takenById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    RunInput.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        cooperativeId: { type: DataTypes.UUID, allowNull: false },
        runId: { type: DataTypes.UUID, allowNull: false },
        deliveryId: { type: DataTypes.UUID, allowNull: false },
        litres: { type: DataTypes.DOUBLE, allowNull: false },
        takenAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        takenById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'run_inputs' },
    );
  }
}
