import type { RefObject } from 'react';

/** Brings a rendered view into sight; native screens scroll with their ScrollView instead (not needed yet). */
export function scrollIntoView(_ref: RefObject<unknown>) {}
