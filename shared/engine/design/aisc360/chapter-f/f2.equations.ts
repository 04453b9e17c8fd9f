/**
 * AISC 360-16 Section F2, doubly symmetric compact I-shaped members bent about the major
 * axis: one function per numbered equation. Units: kip, in, ksi (moments in kip-in).
 */

/** Eq. F2-1: Mn = Mp = Fy Zx (kip-in). */
export const eqF2_1 = (fyKsi: number, zxIn3: number): number => fyKsi * zxIn3;

/** Eq. F2-2: Mn = Cb [Mp − (Mp − 0.7 Fy Sx)(Lb − Lp)/(Lr − Lp)] ≤ Mp (kip-in). */
export function eqF2_2(
  cb: number, mpKipIn: number, fyKsi: number, sxIn3: number, lbIn: number, lpIn: number, lrIn: number,
): number {
  const mn = cb * (mpKipIn - (mpKipIn - 0.7 * fyKsi * sxIn3) * ((lbIn - lpIn) / (lrIn - lpIn)));
  return Math.min(mn, mpKipIn);
}

/** Eq. F2-3: Mn = Fcr Sx ≤ Mp (kip-in). */
export const eqF2_3 = (fcrKsi: number, sxIn3: number, mpKipIn: number): number => Math.min(fcrKsi * sxIn3, mpKipIn);

/** Eq. F2-4: Fcr = Cb π² E / (Lb/rts)² · sqrt(1 + 0.078 (J c / (Sx ho)) (Lb/rts)²) (ksi). */
export function eqF2_4(
  cb: number, eKsi: number, lbIn: number, rtsIn: number, jIn4: number, c: number, sxIn3: number, hoIn: number,
): number {
  const slr2 = (lbIn / rtsIn) ** 2;
  return ((cb * Math.PI ** 2 * eKsi) / slr2) * Math.sqrt(1 + 0.078 * ((jIn4 * c) / (sxIn3 * hoIn)) * slr2);
}

/** Eq. F2-5: Lp = 1.76 ry sqrt(E/Fy) (in). */
export const eqF2_5 = (ryIn: number, eKsi: number, fyKsi: number): number => 1.76 * ryIn * Math.sqrt(eKsi / fyKsi);

/** Eq. F2-6: Lr = 1.95 rts (E/0.7Fy) sqrt( Jc/(Sx ho) + sqrt( (Jc/(Sx ho))² + 6.76 (0.7Fy/E)² ) ) (in). */
export function eqF2_6(
  rtsIn: number, eKsi: number, fyKsi: number, jIn4: number, c: number, sxIn3: number, hoIn: number,
): number {
  const jc = (jIn4 * c) / (sxIn3 * hoIn);
  return 1.95 * rtsIn * (eKsi / (0.7 * fyKsi)) * Math.sqrt(jc + Math.sqrt(jc * jc + 6.76 * ((0.7 * fyKsi) / eKsi) ** 2));
}

/** Eq. F2-8a: c = 1 for a doubly symmetric I-shape. */
export const C_DOUBLY_SYMMETRIC = 1;
