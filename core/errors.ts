/**
 * The one error class of Lockstep and the one way to declare errors. Every layer keeps its own table
 * (core/errors.ts CORE_ERR_*, form/errors.ts and server/errors.ts APP_ERR_*, store/errors.ts STORE_ERR_*,
 * cli/errors.ts CLI_ERR_*), made with `declareErrors`: each code is declared once with its status and the
 * builder of its message, and call sites only call the builders. Every declared code has its row in
 * docs/errors.md (test/architecture/errors.test.ts).
 */

/** An error with a stable code (docs/errors.md), the HTTP status a route answers with, and one line per problem. */
export class LockstepError<C extends string = string> extends Error {
  constructor(
    readonly code: C,
    message: string,
    readonly status: number,
    readonly details: readonly string[] = [],
  ) {
    super(message);
    this.name = 'LockstepError';
  }
}

/** One row of an error table: the code, its status, the message and (optionally) the lines per problem. */
export interface ErrorSpec<C extends string, A extends readonly unknown[]> {
  code: C;
  status: number;
  message: (...args: A) => string;
  details?: (...args: A) => readonly string[];
}

/** The builder of one declared error; it carries its code and status for the tables' tests. */
export type ErrorBuilder<C extends string, A extends readonly unknown[]> = ((...args: A) => LockstepError<C>) & {
  readonly code: C;
  readonly status: number;
};

// eslint-disable-next-line @typescript-eslint/no-explicit-any
type AnySpec = ErrorSpec<string, any>;
type Builders<T extends Record<string, AnySpec>> = {
  readonly [K in keyof T]: T[K] extends { code: infer C extends string; message: (...args: infer A) => string } ? ErrorBuilder<C, A> : never;
};

/**
 * A layer's error table: `{ builderName: { code, status, message, details? } }` in, `{ builderName(...args) }`
 * out. A code declared twice in one table is refused when the module loads.
 */
export function declareErrors<const T extends Record<string, AnySpec>>(table: T): Builders<T> {
  const seen = new Set<string>();
  const out: Record<string, unknown> = {};
  for (const [name, spec] of Object.entries(table)) {
    if (seen.has(spec.code)) throw new Error(`${spec.code} is declared twice in one error table`);
    seen.add(spec.code);
    const build = (...args: unknown[]) => new LockstepError(spec.code, spec.message(...args), spec.status, spec.details ? spec.details(...args) : []);
    out[name] = Object.assign(build, { code: spec.code, status: spec.status });
  }
  return out as Builders<T>;
}

/** The codes a table declares, in table order. */
export function declaredCodes(builders: Readonly<Record<string, { readonly code: string }>>): string[] {
  return Object.values(builders).map((b) => b.code);
}

/** True when `e` is an error of this table. */
export function isDeclaredIn(builders: Readonly<Record<string, { readonly code: string }>>, e: unknown): e is LockstepError {
  return e instanceof LockstepError && Object.values(builders).some((b) => b.code === e.code);
}

const at = (path: string | null): string => (path === null ? '' : `${path || '(root)'}: `);

/**
 * Errors of the core. Each is a programming error at the caller (the design and axle-lift schemas refuse such
 * input first), so each answers 500 where it reaches a route.
 */
export const coreErrors = declareErrors({
  /** `path` null: the number alone; '' the root of the value. */
  canonicalNonFinite: {
    code: 'CORE_ERR_CANONICAL_NON_FINITE',
    status: 500,
    message: (path: string | null, n: number) => `${at(path)}${String(n)} has no JSON form (numbers must be finite)`,
  },
  canonicalType: { code: 'CORE_ERR_CANONICAL_TYPE', status: 500, message: (path: string, type: string) => `${at(path)}a ${type} has no JSON form` },
  unknownRule: {
    code: 'CORE_ERR_UNKNOWN_RULE',
    status: 500,
    message: (unknown: readonly string[], known: readonly string[]) => `unknown rule id ${unknown.join(', ')}; known: ${known.join(', ')}`,
  },
  ruleTable: { code: 'CORE_ERR_RULE_TABLE', status: 500, message: (what: string) => `the rule-set tables have no ${what}` },
  sizingPath: { code: 'CORE_ERR_SIZING_PATH', status: 500, message: (why: string) => why },
  occupantMass: { code: 'CORE_ERR_OCCUPANT_MASS', status: 500, message: () => 'basis "custom" needs mass_kg' },
  axleLiftEmpty: { code: 'CORE_ERR_AXLE_LIFT_EMPTY', status: 500, message: () => 'at least one lift is needed' },
  axleLiftReading: { code: 'CORE_ERR_AXLE_LIFT_READING', status: 500, message: () => 'each lift needs exactly one of front_axle_kg and rear_axle_kg' },
  axleLiftMeasure: { code: 'CORE_ERR_AXLE_LIFT_MEASURE', status: 500, message: () => 'each lift needs lift_height_m or lift_angle_deg' },
  unknownValve: { code: 'CORE_ERR_UNKNOWN_VALVE', status: 500, message: (type: string, known: string) => `rear valve type ${type} is not one of ${known}` },
});
