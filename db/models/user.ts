import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

import { ROLES, type Role } from '@/lib/roles';

export { ROLES, type Role };

/** A person who signs in; one role in one cooperative. */
export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<string>;
  declare cooperativeId: string;
  /** Required for members; optional for sugarmakers and coordinators who also deliver sap. */
  declare householdId: string | null;
  declare name: string;
  /** Stored lower-case; unique across the deployment. */
  declare email: string;
  /** bcrypt hash; null until the person accepts their invitation. */
  declare passwordHash: CreationOptional<string | null>;
  declare role: Role;
  /** SHA-256 of the one-time invitation token sent in the welcome e-mail. */
  declare inviteTokenHash: CreationOptional<string | null>;
  declare inviteExpiresAt: CreationOptional<Date | null>;
  /** Raised to end every session of this person (role, household or password change, sign out everywhere). */
  declare sessionVersion: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    User.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        cooperativeId: { type: DataTypes.UUID, allowNull: false },
        householdId: { type: DataTypes.UUID, allowNull: true },
        name: { type: DataTypes.TEXT, allowNull: false },
        email: { type: DataTypes.TEXT, allowNull: false },
        passwordHash: { type: DataTypes.TEXT, allowNull: true },
        role: { type: DataTypes.ENUM(...ROLES), allowNull: false },
        inviteTokenHash: { type: DataTypes.TEXT, allowNull: true },
        inviteExpiresAt: { type: DataTypes.DATE, allowNull: true },
        sessionVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'users' },
    );
  }
}
