import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One correction of a lot: who, when, why, and the changed fields before and after (API names, SI). */
export class DeliveryRevision extends Model<InferAttributes<DeliveryRevision>, InferCreationAttributes<DeliveryRevision>> {
  declare id: CreationOptional<string>;
  declare cooperativeId: string;
  declare deliveryId: string;
  declare changedBy: string | null;
  declare changedAt: CreationOptional<Date>;
  declare reason: string;
  declare before: Record<string, unknown>;
  declare after: Record<string, unknown>;

  static initModel(sequelize: Sequelize) {
    DeliveryRevision.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        cooperativeId: { type: DataTypes.UUID, allowNull: false },
        deliveryId: { type: DataTypes.UUID, allowNull: false },
        changedBy: { type: DataTypes.UUID, allowNull: true },
        changedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        reason: { type: DataTypes.TEXT, allowNull: false },
        before: { type: DataTypes.JSONB, allowNull: false },
        after: { type: DataTypes.JSONB, allowNull: false },
      },
      { sequelize, tableName: 'delivery_revisions', timestamps: false },
    );
  }
}
