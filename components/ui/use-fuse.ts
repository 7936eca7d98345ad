import type Fuse from 'fuse.js';
import type { IFuseOptions } from 'fuse.js';
import { useEffect, useMemo, useState } from 'react';

type FuseClass = typeof Fuse;
let loaded: FuseClass | undefined;
let loading: Promise<FuseClass> | undefined;

/** fuse.js, fetched once on first use: only the food picker and the recipe shelf search with it. */
function loadFuse(): Promise<FuseClass> {
  loading ??= import('fuse.js').then((m) => (loaded = m.default));
  return loading;
}

/**
 * A fuzzy index over `items` (fuse.js), or undefined for the moment fuse.js is still loading. fuse.js is fetched on
 * first use rather than imported: an import from two screens put it in the shared chunk every first screen loads.
 * `options` must be stable (a module constant).
 */
export function useFuse<T>(items: readonly T[], options: IFuseOptions<T>): Fuse<T> | undefined {
  const [FuseCtor, setFuseCtor] = useState<FuseClass | undefined>(() => loaded);
  useEffect(() => {
    if (FuseCtor) return;
    let live = true;
    void loadFuse().then((ctor) => live && setFuseCtor(() => ctor));
    return () => {
      live = false;
    };
  }, [FuseCtor]);
  return useMemo(() => (FuseCtor ? new FuseCtor(items, options) : undefined), [FuseCtor, items, options]);
}
