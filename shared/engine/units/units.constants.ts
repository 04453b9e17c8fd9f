/** Modulus of elasticity of steel, AISC 360-16 (E = 29,000 ksi). */
export const E_KSI = 29000;
export const IN_PER_FT = 12;
/** ft³ → in³, for deflections from kip·ft³ / (ksi · in⁴). */
export const IN3_PER_FT3 = 1728;

export const plfToKlf = (plf: number): number => plf / 1000;
export const kipInToKipFt = (kipIn: number): number => kipIn / IN_PER_FT;
export const ftToIn = (ft: number): number => ft * IN_PER_FT;
export const inToFt = (inch: number): number => inch / IN_PER_FT;
