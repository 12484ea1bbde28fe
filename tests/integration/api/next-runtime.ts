// Next's server runtime installs AsyncLocalStorage on globalThis before any of its modules load; request-scoped
// APIs (headers()) are built on it. Import this module first, before anything that imports next/*.
import { AsyncLocalStorage } from "node:async_hooks";

const scope = globalThis as typeof globalThis & { AsyncLocalStorage?: typeof AsyncLocalStorage };
scope.AsyncLocalStorage ??= AsyncLocalStorage;
