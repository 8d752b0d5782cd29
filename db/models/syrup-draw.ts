import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { GradeClass } from '@/lib/sugar';

/** Finished syrup drawn off a run's pan. */
export class SyrupDraw extends Model<InferAttributes<SyrupDraw>, InferCreationAttributes<SyrupDraw>> {
  declare id: CreationOptional<string>;
  declare cooperativeId: string;
  declare runId: string;
  declare drawnAt: Date;
  declare litres: number;
  declare brix: number;
  /** Light transmittance at 560 nm (%Tc), when measured. */
  declare transmittancePct: number | null;
  /** Colour class of the grading standard, from the transmittance or judged by eye. */
  declare gradeClass: GradeClass;
  /** Temperature of the syrup at draw-off (°C). */
  declare temperatureC: number | null;
  declare recordedById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SyrupDraw.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        cooperativeId: { type: DataTypes.UUID, allowNull: false },
        runId: { type: DataTypes.UUID, allowNull: false },
        drawnAt: { type: DataTypes.DATE, allowNull: false },
        litres: { type: DataTypes.DOUBLE, allowNull: false },
        brix: { type: DataTypes.DOUBLE, allowNull: false },
        transmittancePct: { type: DataTypes.DOUBLE, allowNull: true },
        gradeClass: { type: DataTypes.TEXT, allowNull: false },
        temperatureC: { type: DataTypes.DOUBLE, allowNull: true },
        recordedById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'syrup_draws' },
    );
  }
}
