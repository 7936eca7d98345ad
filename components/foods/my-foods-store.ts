import { useSyncExternalStore } from 'react';
import type { FoodSummary } from '../../shared/schemas/food';
import { deviceStorage } from '../auth/device-storage';

const KEY = 'carbwright.my-foods';
const RECENT_MAX = 20;

type State = { recent: FoodSummary[]; favourites: FoodSummary[] };
const EMPTY: State = { recent: [], favourites: [] };


function load(): State {
  try {
    const raw = deviceStorage()?.getItem(KEY);
    const parsed = raw ? (JSON.parse(raw) as State) : EMPTY;
    return { recent: parsed.recent ?? [], favourites: parsed.favourites ?? [] };
  } catch {
    return EMPTY;
  }
}

let state: State = load();
const listeners = new Set<() => void>();

function set(next: State) {
  state = next;
  deviceStorage()?.setItem(KEY, JSON.stringify(next));
  for (const l of listeners) l();
}

/** Recent and favourite foods, kept on this device (they are shortcuts, not records). */
export const myFoods = {
  get: () => state,
  subscribe(listener: () => void) {
    listeners.add(listener);
    return () => listeners.delete(listener);
  },
  /** Puts a picked food at the top of the recent list. */
  touch(food: FoodSummary) {
    set({ ...state, recent: [food, ...state.recent.filter((f) => f.id !== food.id)].slice(0, RECENT_MAX) });
  },
  toggleFavourite(food: FoodSummary) {
    const has = state.favourites.some((f) => f.id === food.id);
    set({ ...state, favourites: has ? state.favourites.filter((f) => f.id !== food.id) : [food, ...state.favourites] });
  },
  clear() {
    set(EMPTY);
  },
};

/** The recent and favourite foods, re-rendering when they change. */
export function useMyFoods(): State {
  return useSyncExternalStore(myFoods.subscribe, myFoods.get, myFoods.get);
}
