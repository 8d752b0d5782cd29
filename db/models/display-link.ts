import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A revocable link that shows the co-op's live queue on a sugarhouse screen without signing in. */
export class DisplayLink extends Model<InferAttributes<DisplayLink>, InferCreationAttributes<DisplayLink>> {
  declare id: CreationOptional<string>;
  declare cooperativeId: string;
  declare name: string;
  /** SHA-256 of the token in the link, hex; the token itself is shown once and never stored. */
  declare tokenHash: string;
  declare createdById: string | null;
  declare revokedAt: CreationOptional<Date | null>;
  declare revokedById: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    DisplayLink.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        cooperativeId: { type: DataTypes.UUID, allowNull: false },
        name: { type: DataTypes.TEXT, allowNull: false },
        tokenHash: { type: DataTypes.TEXT, allowNull: false },
        createdById: { type: DataTypes.UUID, allowNull: true },
        revokedAt: { type: DataTypes.DATE, allowNull: true },
        revokedById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'display_links' },
    );
  }
}
