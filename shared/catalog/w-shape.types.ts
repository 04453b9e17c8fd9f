/** One rolled W-shape row of the AISC Shapes Database v15.0 (units in the field names). */
export interface WShape {
  label: string;
  W_plf: number;
  A_in2: number;
  d_in: number;
  bf_in: number;
  tw_in: number;
  tf_in: number;
  kdes_in: number;
  kdet_in: number;
  k1_in: number;
  bf_2tf: number;
  h_tw: number;
  Ix_in4: number;
  Zx_in3: number;
  Sx_in3: number;
  rx_in: number;
  Iy_in4: number;
  Zy_in3: number;
  Sy_in3: number;
  ry_in: number;
  J_in4: number;
  Cw_in6: number;
  rts_in: number;
  ho_in: number;
  Wno_in2: number;
  Sw1_in4: number;
  Qf_in3: number;
  Qw_in3: number;
}

/** Column order of the CSV, which the generated module keeps. */
export const W_SHAPE_COLUMNS = [
  'label', 'W_plf', 'A_in2', 'd_in', 'bf_in', 'tw_in', 'tf_in', 'kdes_in', 'kdet_in', 'k1_in',
  'bf_2tf', 'h_tw', 'Ix_in4', 'Zx_in3', 'Sx_in3', 'rx_in', 'Iy_in4', 'Zy_in3', 'Sy_in3', 'ry_in',
  'J_in4', 'Cw_in6', 'rts_in', 'ho_in', 'Wno_in2', 'Sw1_in4', 'Qf_in3', 'Qw_in3',
] as const satisfies readonly (keyof WShape)[];
