/**
 * Layout of a kinematics scratch array, the "object in hand" of the detector's
 * hot loop: reading and writing one `Float64Array` instead of passing seven
 * numbers from function to function keeps the loop free of per-call number
 * boxing (V8 boxes floating-point arguments of calls it does not inline).
 */
export const K_PX = 0;
export const K_PY = 1;
export const K_PZ = 2;
export const K_E = 3;
export const K_PT = 4;
export const K_ETA = 5;
export const K_PHI = 6;
export const K_ABS_ETA = 7;
/** Length of a kinematics scratch array. */
export const KINEMATICS_SLOTS = 8;
