import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export type SapClarity = 'clear' | 'cloudy';
export type SapContamination = 'none' | 'insects' | 'debris' | 'off-odour' | 'other';
export type DeliveryStatus = 'accepted' | 'rejected';
export type DeliveryDecision = 'accept' | 'reject';

/**
 * A metered sap drop-off ("lot") received at the sugarhouse; SI units. Rejected lots stay on
 * record and never count toward sugar, planning, the queue or the split.
 */
export class SapDelivery extends Model<InferAttributes<SapDelivery>, InferCreationAttributes<SapDelivery>> {
  declare id: CreationOptional<string>;
  declare cooperativeId: string;
  declare seasonId: string;
  declare householdId: string;
  declare receivedAt: CreationOptional<Date>;
  /** The day the oldest sap in the lot was collected ('YYYY-MM-DD', the co-op's calendar). */
  declare collectedOn: string;
  /** Metered volume in litres (whole millilitres). */
  declare volumeL: number;
  /** Refractometer reading, 0.1 °Bx (numeric(3,1) in the database; a number here). */
  declare brix: number;
  declare sapTempC: number;
  declare clarity: SapClarity;
  declare contamination: SapContamination;
  /** Optional sugarbush mix in percent; all three or none, summing to 100. */
  declare sugarMaplePct: number | null;
  declare redMaplePct: number | null;
  declare otherPct: number | null;
  /** What the acceptance rules recommended when the lot was logged or last corrected. */
  declare recommendation: DeliveryDecision;
  declare status: DeliveryStatus;
  /** Why the lot was rejected, or why it was accepted against the recommendation. */
  declare reason: string | null;
  /** Object-store key of the photo, under the co-op's prefix. */
  declare photoKey: string | null;
  declare note: string | null;
  declare loggedBy: string | null;
  /** Litres taken into boil runs so far (kept by a trigger on run_inputs; never above the volume). */
  declare litresBoiled: CreationOptional<number>;
  /** Made once per form fill; unique per co-op so a retried post never makes two lots. */
  declare idempotencyKey: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SapDelivery.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        cooperativeId: { type: DataTypes.UUID, allowNull: false },
        seasonId: { type: DataTypes.UUID, allowNull: false },
        householdId: { type: DataTypes.UUID, allowNull: false },
        receivedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        collectedOn: { type: DataTypes.DATEONLY, allowNull: false },
        volumeL: { type: DataTypes.DOUBLE, allowNull: false },
        brix: {
          type: DataTypes.DECIMAL(3, 1),
          allowNull: false,
          get() {
            const v = this.getDataValue('brix') as unknown;
            return v == null ? (v as unknown as number) : Number(v);
          },
        },
        sapTempC: { type: DataTypes.DOUBLE, allowNull: false },
        clarity: { type: DataTypes.ENUM('clear', 'cloudy'), allowNull: false },
        contamination: { type: DataTypes.ENUM('none', 'insects', 'debris', 'off-odour', 'other'), allowNull: false },
        sugarMaplePct: { type: DataTypes.SMALLINT, allowNull: true },
        redMaplePct: { type: DataTypes.SMALLINT, allowNull: true },
        otherPct: { type: DataTypes.SMALLINT, allowNull: true },
        recommendation: { type: DataTypes.ENUM('accept', 'reject'), allowNull: false },
        status: { type: DataTypes.ENUM('accepted', 'rejected'), allowNull: false },
        reason: { type: DataTypes.TEXT, allowNull: true },
        photoKey: { type: DataTypes.TEXT, allowNull: true },
        note: { type: DataTypes.TEXT, allowNull: true },
        loggedBy: { type: DataTypes.UUID, allowNull: true },
        litresBoiled: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
        idempotencyKey: { type: DataTypes.TEXT, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'sap_deliveries' },
    );
  }
}
