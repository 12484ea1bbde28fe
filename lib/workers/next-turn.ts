// A write loop's pause between statements. PGlite runs in this process and answers through already-settled
// promises, so a transaction of many statements would otherwise run in one turn of the event loop however many
// awaits it has: every other request (and the engine threads' replies) would wait for all of it.
export function nextTurn(): Promise<void> {
  return new Promise((resolve) => setImmediate(resolve));
}
