/** The shapes every reader of an input file reports in: a problem on a field, and a warning about an odd value. */

export interface FieldIssue {
  /** Field path as written in the file, e.g. `load_states[1].front_axle_kg`; "" for the whole file. */
  path: string;
  message: string;
}

export interface Warning {
  code: string;
  path: string;
  message: string;
}
