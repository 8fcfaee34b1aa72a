import { queryOptions } from '@tanstack/react-query';
import { companyDataTableResponse } from '@contract';
import { apiFetch } from '../../../lib/api-client';
import { deskKeys } from '../query-keys';

/** A catalog model as the desk's pickers and comparison read it (the record is the price book's row). */
export interface DeskModel {
  readonly key: string;
  readonly name: string;
  readonly kind: string;
  readonly seer2: number | null;
  readonly hspf2: number | null;
  readonly soundDba: number | null;
  readonly nominalCoolingBtuh: number | null;
  readonly ports: number | null;
  /** Indoor units: wall, ceiling-cassette, floor-console, slim-ducted, air-handler ('' for other kinds). */
  readonly indoorType: string;
  /** Heat kits: the electric heat, kW. */
  readonly heatKitKw: number | null;
  /** The models it is matched with (a heat kit: the air handlers it is listed for). */
  readonly matchedKeys: readonly string[];
}

const num = (v: unknown): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null);
const str = (v: unknown): string => (typeof v === 'string' ? v : '');

/** GET /api/company-data/models (every role reads the catalog; cost fields are the server's to hide). */
export const modelsQueryOptions = () =>
  queryOptions({
    queryKey: deskKeys.models(),
    queryFn: async ({ signal }) => {
      const { rows } = await apiFetch('/api/company-data/models', { schema: companyDataTableResponse, signal });
      return rows
        .filter((r) => r.record.active !== false)
        .map((r): DeskModel => ({
          key: r.key,
          name: str(r.record.name),
          kind: str(r.record.kind),
          seer2: num(r.record.seer2),
          hspf2: num(r.record.hspf2),
          soundDba: num(r.record.soundDba),
          nominalCoolingBtuh: num(r.record.nominalCoolingBtuh),
          ports: num(r.record.ports),
          indoorType: str(r.record.indoorType),
          heatKitKw: num(r.record.heatKitKw),
          matchedKeys: Array.isArray(r.record.matchedKeys)
            ? r.record.matchedKeys.filter((k): k is string => typeof k === 'string')
            : [],
        }));
    },
    staleTime: 5 * 60_000,
  });
