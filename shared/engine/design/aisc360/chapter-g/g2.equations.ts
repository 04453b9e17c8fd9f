/** AISC 360-16 Section G2.1, shear strength of webs without tension field action. kip, in, ksi. */

/** Eq. G2-1: Vn = 0.6 Fy Aw Cv1 (kip), Aw = d tw. */
export const eqG2_1 = (fyKsi: number, awIn2: number, cv1: number): number => 0.6 * fyKsi * awIn2 * cv1;

/** Eq. G2-2: Cv1 = 1.0 for rolled I-shape webs with h/tw ≤ 2.24 sqrt(E/Fy) (G2.1(a)). */
export const eqG2_2 = (): number => 1.0;

/** Eq. G2-3: Cv1 = 1.0 when h/tw ≤ 1.10 sqrt(kv E/Fy) (G2.1(b)(1)(i)). */
export const eqG2_3 = (): number => 1.0;

/** Eq. G2-4: Cv1 = 1.10 sqrt(kv E/Fy) / (h/tw) when h/tw > 1.10 sqrt(kv E/Fy) (G2.1(b)(1)(ii)). */
export const eqG2_4 = (kv: number, eKsi: number, fyKsi: number, hTw: number): number =>
  (1.1 * Math.sqrt((kv * eKsi) / fyKsi)) / hTw;

/** kv = 5.34 for webs without transverse stiffeners (AISC 360-16 G2.1(b)(2)(i)). */
export const KV_UNSTIFFENED = 5.34;
