// The job worker waits between polls of an empty queue with a timer that the stop signal can cut short. Each wait
// used to leave its abort listener on the signal, so an idle worker gathered one every 2 s (Node warns after 10).
import { getEventListeners } from "node:events";
import { describe, expect, it } from "vitest";
import { sleep } from "@/lib/jobs/worker";

describe("the worker's idle wait", () => {
  it("leaves no listener on the stop signal after the wait ends", async () => {
    const controller = new AbortController();
    for (let i = 0; i < 15; i++) await sleep(1, controller.signal);
    expect(getEventListeners(controller.signal, "abort")).toHaveLength(0);
  });

  it("still ends at once when the signal aborts, and then too leaves nothing behind", async () => {
    const controller = new AbortController();
    const waiting = sleep(60_000, controller.signal);
    expect(getEventListeners(controller.signal, "abort")).toHaveLength(1);
    controller.abort();
    await waiting;
    expect(getEventListeners(controller.signal, "abort")).toHaveLength(0);
    await sleep(60_000, controller.signal); // already aborted: returns at once
  });
});
