import { BTUH_PER_TON, roundHalfUp } from '@calc';

/** Btu/h as nominal tons, to two places. */
export const tons = (btuh: number) => roundHalfUp(btuh / BTUH_PER_TON, 2);
