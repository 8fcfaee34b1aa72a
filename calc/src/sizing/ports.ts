/**
 * Puts indoor units on a multi-zone outdoor unit's ports: each port accepts the indoor nominal
 * sizes the maker lists for it (port A often takes a larger size than the others). Returns, for
 * each indoor unit in order, the index of its port, or null when no assignment seats them all.
 * Deterministic: tries the ports in order, most constrained indoor unit first, backtracking
 * (at most 8 ports, so at most 8! tries). [Maker's port table]
 */
export function assignPorts({
  portSizesBtuh,
  indoorNominalBtuh,
}: {
  readonly portSizesBtuh: readonly (readonly number[])[];
  readonly indoorNominalBtuh: readonly number[];
}): number[] | null {
  const n = indoorNominalBtuh.length;
  if (n > portSizesBtuh.length) return null;
  const fits = indoorNominalBtuh.map((size) =>
    portSizesBtuh.map((p, i) => (p.includes(size) ? i : -1)).filter((i) => i >= 0),
  );
  const order = indoorNominalBtuh
    .map((_, i) => i)
    .sort((a, b) => (fits[a]?.length ?? 0) - (fits[b]?.length ?? 0) || a - b);
  const used = new Array<boolean>(portSizesBtuh.length).fill(false);
  const seat = new Array<number>(n).fill(-1);
  const place = (k: number): boolean => {
    if (k === n) return true;
    const unit = order[k] ?? 0;
    for (const p of fits[unit] ?? []) {
      if (used[p]) continue;
      used[p] = true;
      seat[unit] = p;
      if (place(k + 1)) return true;
      used[p] = false;
    }
    return false;
  };
  return place(0) ? seat : null;
}

/** Port letter: 0 → "A". */
export function portLetter(i: number): string {
  return String.fromCharCode(65 + i);
}
