import { useSyncExternalStore } from 'react';

const subscribeNever = () => () => {};

/**
 * Whether this render is in the browser (false while the server renders the page, and while
 * the browser hydrates it). The review page's ways table and revision comparison, and the
 * schedule page's table, are drawn there only: on the server they would render a placeholder
 * anyway (their data loads in the browser), or render their rows twice (as React Server
 * Component output and again as HTML), which made the review page cost the server about four
 * times a light page of the app.
 */
export const useInBrowser = () =>
  useSyncExternalStore(
    subscribeNever,
    () => true,
    () => false,
  );
