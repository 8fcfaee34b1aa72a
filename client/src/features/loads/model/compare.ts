import type { HomeLoad } from '@calc';

/** The parts of GET /api/jobs/:id/loads that are compared (the contract's LoadsResponse fits it). */
export interface ServerLoadsLike {
  readonly loads: {
    readonly rooms: readonly {
      readonly roomId: string;
      readonly coolingTotalBtuh: number;
      readonly heatLoss: { readonly total: number };
    }[];
    readonly totals: {
      readonly sensibleBtuh: number;
      readonly latentBtuh: number;
      readonly heatingBtuh: number;
      readonly sensibleHeatRatio: number;
    };
  };
}

export interface LoadMismatch {
  readonly what: string;
  readonly browser: number;
  readonly server: number;
}

/** Every figure the page shows, browser against server; both run calc, so any difference is a bug or stale data. */
export function compareLoads(browser: HomeLoad, server: ServerLoadsLike): LoadMismatch[] {
  const out: LoadMismatch[] = [];
  const check = (what: string, b: number, s: number) => {
    if (b !== s) out.push({ what, browser: b, server: s });
  };
  const bt = browser.totals;
  const st = server.loads.totals;
  check('Whole-home sensible gain', bt.sensibleBtuh, st.sensibleBtuh);
  check('Whole-home latent gain', bt.latentBtuh, st.latentBtuh);
  check('Whole-home heat loss', bt.heatingBtuh, st.heatingBtuh);
  check('Sensible heat ratio', bt.sensibleHeatRatio, st.sensibleHeatRatio);
  for (const room of browser.rooms) {
    const other = server.loads.rooms.find((r) => r.roomId === room.roomId);
    if (!other) {
      out.push({ what: `${room.roomName}: not on the server`, browser: room.coolingTotalBtuh, server: 0 });
      continue;
    }
    check(`${room.roomName}: total cooling`, room.coolingTotalBtuh, other.coolingTotalBtuh);
    check(`${room.roomName}: heat loss`, room.heatLoss.total, other.heatLoss.total);
  }
  if (server.loads.rooms.length !== browser.rooms.length)
    check('Number of rooms', browser.rooms.length, server.loads.rooms.length);
  return out;
}
