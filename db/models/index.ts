import type { Sequelize } from 'sequelize';
import { getSequelize } from '@/db';
import { Cooperative } from './cooperative';
import { Household } from './household';
import { User } from './user';
import { Season } from './season';
import { Evaporator } from './evaporator';
import { BoilSlot } from './boil-slot';
import { SapDelivery } from './sap-delivery';
import { DeliveryRevision } from './delivery-revision';
import { BoilRun } from './boil-run';
import { RunInput } from './run-input';
import { SyrupDraw } from './syrup-draw';
import { FuelUse } from './fuel-use';
import { DisplayLink } from './display-link';
import { PasswordReset } from './password-reset';

export { Cooperative, Household, User, Season, Evaporator, BoilSlot, SapDelivery, DeliveryRevision, BoilRun, RunInput, SyrupDraw, FuelUse, DisplayLink, PasswordReset };
export type { Role } from './user';
export { ROLES } from './user';

const models = { Cooperative, Household, User, Season, Evaporator, BoilSlot, SapDelivery, DeliveryRevision, BoilRun, RunInput, SyrupDraw, FuelUse, DisplayLink, PasswordReset };
export type Models = typeof models;

// Per module instance: Next bundles its own copy of these classes beside the custom server's.
let boundTo: Sequelize | undefined;

function wire(sequelize: Sequelize) {
  for (const m of Object.values(models)) m.initModel(sequelize);
  Household.hasMany(User, { foreignKey: 'householdId', as: 'people' });
  User.belongsTo(Household, { foreignKey: 'householdId', as: 'household' });
  Cooperative.hasMany(Household, { foreignKey: 'cooperativeId' });
  Cooperative.hasMany(Evaporator, { foreignKey: 'cooperativeId' });
  Cooperative.hasMany(Season, { foreignKey: 'cooperativeId' });
  BoilSlot.belongsTo(Household, { foreignKey: 'householdId', as: 'household' });
  BoilSlot.belongsTo(Evaporator, { foreignKey: 'evaporatorId', as: 'evaporator' });
  BoilSlot.belongsTo(Season, { foreignKey: 'seasonId', as: 'season' });
  SapDelivery.belongsTo(Household, { foreignKey: 'householdId', as: 'household' });
  SapDelivery.belongsTo(Season, { foreignKey: 'seasonId', as: 'season' });
  SapDelivery.hasMany(DeliveryRevision, { foreignKey: 'deliveryId', as: 'revisions' });
  DeliveryRevision.belongsTo(SapDelivery, { foreignKey: 'deliveryId', as: 'delivery' });
  BoilRun.hasMany(RunInput, { foreignKey: 'runId', as: 'inputs' });
  BoilRun.hasMany(SyrupDraw, { foreignKey: 'runId', as: 'draws' });
  BoilRun.hasMany(FuelUse, { foreignKey: 'runId', as: 'fuel' });
}

/** The models, bound once to the shared Sequelize instance. */
export function db(): Models & { sequelize: Sequelize } {
  const sequelize = getSequelize();
  if (boundTo !== sequelize) {
    wire(sequelize);
    boundTo = sequelize;
  }
  return { ...models, sequelize };
}
