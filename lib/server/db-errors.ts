import { AppError, type ErrorKind } from './errors';

/**
 * Database refusals as domain errors, by SQLSTATE and constraint name (never by message text).
 * Features register their own constraints next to their service:
 *
 *   registerConstraints({ deliveries_volume_positive: { code: 'volume_invalid', field: 'volumeL', message: 'Enter a volume above 0 L.' } });
 */

export interface ConstraintEntry {
  /** Stable code for the error body. */
  code: string;
  /** Summary message; the field message below goes on the field. */
  message: string;
  /** The request field at fault, if any. */
  field?: string;
  /** Message on the field (defaults to `message`). */
  fieldMessage?: string;
  /** Overrides the kind the SQLSTATE would give (e.g. a unique index that means "not found"). */
  kind?: ErrorKind;
}

const constraints = new Map<string, ConstraintEntry>();

/** Adds (or replaces) constraint-name entries; call once at module load of a feature's service. */
export function registerConstraints(entries: Record<string, ConstraintEntry>) {
  for (const [name, entry] of Object.entries(entries)) constraints.set(name, entry);
}

export function constraintEntry(name: string | undefined): ConstraintEntry | undefined {
  return name ? constraints.get(name) : undefined;
}

/** The PostgreSQL error under a Sequelize error (or the error itself when it came from pg). */
export interface PgErrorLike {
  code: string;
  constraint?: string;
  column?: string;
  table?: string;
  detail?: string;
}

export function pgError(err: unknown): PgErrorLike | null {
  if (!err || typeof err !== 'object') return null;
  const e = err as { parent?: unknown; original?: unknown; code?: unknown };
  for (const candidate of [e.parent, e.original, err]) {
    const code = (candidate as { code?: unknown } | undefined)?.code;
    if (typeof code === 'string' && /^[0-9A-Z]{5}$/.test(code)) return candidate as PgErrorLike;
  }
  return null;
}

export const sqlState = (err: unknown): string | null => pgError(err)?.code ?? null;

/** 40001 serialization failure, 40P01 deadlock: the whole transaction may be tried again. */
export const isRetryableTransactionError = (err: unknown) => {
  const code = sqlState(err);
  return code === '40001' || code === '40P01';
};

const CONNECTION_CODES = new Set(['57P01', '57P02', '57P03', '08000', '08001', '08003', '08004', '08006', '53300']);
const CONNECTION_NAMES = new Set(['SequelizeConnectionError', 'SequelizeConnectionRefusedError', 'SequelizeConnectionAcquireTimeoutError', 'SequelizeHostNotReachableError']);
const SOCKET_CODES = new Set(['ECONNRESET', 'ECONNREFUSED', 'EPIPE', 'ETIMEDOUT']);

/** The connection went away (database restart, network); safe to retry only reads and idempotent writes. */
export function isConnectionError(err: unknown): boolean {
  if (!err || typeof err !== 'object') return false;
  const e = err as { name?: string; parent?: { code?: string }; original?: { code?: string }; code?: string };
  if (e.name && CONNECTION_NAMES.has(e.name)) return true;
  const code = e.parent?.code ?? e.original?.code ?? e.code;
  return !!code && (CONNECTION_CODES.has(code) || SOCKET_CODES.has(code));
}

const camel = (s: string) => s.replace(/_([a-z0-9])/g, (_, c: string) => c.toUpperCase());

/** `boil_slots_household_id_fkey` → `householdId` (PostgreSQL's default foreign-key names). */
function fieldFromFkName(constraint: string | undefined, table: string | undefined): string | undefined {
  if (!constraint) return undefined;
  let rest = constraint.replace(/_fkey$/, '');
  if (rest === constraint) return undefined;
  if (table && rest.startsWith(`${table}_`)) rest = rest.slice(table.length + 1);
  return camel(rest);
}

/** `Key (household_id, cooperative_id)=(…)` → `householdId` (the first column, a structured part of the detail). */
function fieldFromDetail(detail: string | undefined): string | undefined {
  const m = detail?.match(/^Key \(([a-z0-9_]+)/);
  return m ? camel(m[1]) : undefined;
}

interface StateRule {
  kind: ErrorKind;
  code: string;
  message: string;
}

/** SQLSTATE → what a person is told when no constraint entry says better. */
export const SQLSTATE_RULES: Record<string, StateRule> = {
  '23505': { kind: 'conflict', code: 'already_exists', message: 'That already exists.' },
  '23503': { kind: 'invalid', code: 'reference_not_found', message: 'A record this refers to does not exist.' },
  '23514': { kind: 'invalid', code: 'rule_violated', message: 'A value is outside what the co-op allows.' },
  '23502': { kind: 'invalid', code: 'required', message: 'A required value is missing.' },
  '23P01': { kind: 'conflict', code: 'overlaps', message: 'That overlaps an existing record.' },
  '22P02': { kind: 'invalid', code: 'invalid_format', message: 'A value is not in the expected format.' },
  '22007': { kind: 'invalid', code: 'invalid_date', message: 'A date or time is not valid.' },
  '22008': { kind: 'invalid', code: 'invalid_date', message: 'A date or time is out of range.' },
  '22021': { kind: 'invalid', code: 'invalid_text', message: 'Text holds a character that cannot be stored (e.g. a NUL character).' },
  '22001': { kind: 'invalid', code: 'too_long', message: 'A value is too long.' },
  '22003': { kind: 'invalid', code: 'out_of_range', message: 'A number is out of range.' },
  '22025': { kind: 'invalid', code: 'invalid_text', message: 'Text holds an escape character that cannot be used here.' },
  '22023': { kind: 'invalid', code: 'invalid_format', message: 'A value is not valid.' },
  '40001': { kind: 'conflict', code: 'busy', message: 'Someone else changed this at the same moment. Please try again.' },
  '40P01': { kind: 'conflict', code: 'busy', message: 'Someone else changed this at the same moment. Please try again.' },
};

export interface DbErrorContext {
  /** The request's path held ids: a 22P02 then means "no such record" (404), not a bad field. */
  idsInPath?: boolean;
}

/** A database error as a domain error, or null when it is not one a person can act on. */
export function fromDatabaseError(err: unknown, ctx: DbErrorContext = {}): AppError | null {
  const pg = pgError(err);
  if (!pg) return null;
  const rule = SQLSTATE_RULES[pg.code];
  if (!rule) return null;
  if (pg.code === '22P02' && ctx.idsInPath) {
    return new AppError('not_found', 'not_found', 'That record was not found.', { cause: err });
  }
  const entry = constraintEntry(pg.constraint);
  if (entry) {
    const fields = entry.field ? { [entry.field]: entry.fieldMessage ?? entry.message } : undefined;
    return new AppError(entry.kind ?? rule.kind, entry.code, entry.message, { fields, cause: err });
  }
  let field: string | undefined;
  if (pg.code === '23503') field = fieldFromDetail(pg.detail) ?? fieldFromFkName(pg.constraint, pg.table);
  else if (pg.code === '23505') field = fieldFromDetail(pg.detail);
  else if (pg.code === '23502' && pg.column) field = camel(pg.column);
  const fields = field ? { [field]: rule.message } : undefined;
  return new AppError(rule.kind, rule.code, rule.message, { fields, cause: err });
}
