import { useSyncExternalStore } from 'react';

/*
 * One timer for every ticking clock on the page: a queue of thirty rows re-renders once a second,
 * not thirty times, and the timer stops when the last clock leaves the screen.
 */
const listeners = new Set<() => void>();
let now = Date.now();
let timer: ReturnType<typeof setInterval> | undefined;

function subscribe(onTick: () => void) {
  listeners.add(onTick);
  if (!timer) {
    now = Date.now();
    timer = setInterval(() => {
      now = Date.now();
      for (const listener of listeners) listener();
    }, 1000);
  }
  return () => {
    listeners.delete(onTick);
    if (listeners.size === 0 && timer) {
      clearInterval(timer);
      timer = undefined;
    }
  };
}

/** The current time in milliseconds, updated every second while the component is on screen. */
export function useNow(): number {
  return useSyncExternalStore(subscribe, currentTime, currentTime);
}

// Before the first clock subscribes the timer is off, so a long-idle value is refreshed here;
// it changes at most once a second, so React sees the same value within one render.
function currentTime() {
  if (!timer && Date.now() - now >= 1000) now = Date.now();
  return now;
}
