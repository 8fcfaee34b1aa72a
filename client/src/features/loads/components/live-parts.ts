// What the walk-through's live loads load on their own (live-engine.ts): the engine and what shows its figures.
export { computeLiveHomeLoad, computeLiveRoomLoad, primeLive } from '../model/live-room';
export { HomeTotals } from './home-totals';
export { LoadFigures } from './load-figures';
