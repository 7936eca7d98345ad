import { onlineManager } from '@tanstack/react-query';
import { useSyncExternalStore } from 'react';

/** What a write answers when the device is offline: it was never sent, so it is never shown as saved. */
export const NOT_SAVED_OFFLINE = 'Not saved: you are offline. Nothing was sent; try again when you are back online.';

/**
 * Starts the online state from the browser's own word: the query library assumes online until an `offline` event,
 * which never comes when the page is opened without a connection.
 */
export function startOnlineWatch() {
  if (typeof navigator !== 'undefined' && typeof navigator.onLine === 'boolean') onlineManager.setOnline(navigator.onLine);
}

/** Whether the device has a connection now (the query library's one online state: queries pause while offline). */
export const isOnline = () => onlineManager.isOnline();

/** The online state, re-rendering when the connection comes or goes. */
export function useIsOnline(): boolean {
  return useSyncExternalStore(onlineManager.subscribe, isOnline, () => true);
}
