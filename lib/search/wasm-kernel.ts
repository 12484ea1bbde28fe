/**
 * Two scan kernels over 2048-bit fingerprints, assembled here byte by byte (no toolchain). The WebAssembly text of
 * the emitted module, for reading (q = query, list = [chunkAddress, count] pairs, out = result words):
 *
 *   (module
 *     (import "env" "memory" (memory 1))
 *     ;; Writes [list position * 64 + entry, |q ∧ e|] for every entry e with |q ∧ e| ≥ cmin; returns the count.
 *     (func (export "similarity") (param $q i32) (param $list i32) (param $chunks i32) (param $out i32) (param $cmin i32)
 *           (result i32) (local $i i32) (local $j i32) (local $e i32) (local $count i32) (local $n i32) (local $s i32)
 *       block loop                                  ;; for i in 0..chunks
 *         (br_if 1 (i32.ge_u (local.get $i) (local.get $chunks)))
 *         (local.set $e (i32.load (list + 8i)))  (local.set $count (i32.load offset=4 (list + 8i)))  (local.set $j (i32.const 0))
 *         block loop                                ;; for j in 0..count
 *           (br_if 1 (i32.ge_u (local.get $j) (local.get $count)))
 *           (local.set $s (i32.wrap_i64 (i64.add … (i64.popcnt (i64.and (i64.load offset=8k q) (i64.load offset=8k e))) …)))  ;; k = 0..31, unrolled
 *           (if (i32.ge_u (local.get $s) (local.get $cmin)) (then
 *             (i32.store (out + 8n) (i*64 + j))  (i32.store offset=4 (out + 8n) (local.get $s))  (n += 1)))
 *           (j += 1) (e += 256) (br 0)
 *         end end
 *         (i += 1) (br 0)
 *       end end
 *       (local.get $n))
 *     ;; Writes i*64 + j for every entry e that has all of q's bits (q ∧ ¬e = 0), leaving at the first missing word.
 *     (func (export "screen") (param $q i32) (param $list i32) (param $chunks i32) (param $out i32) (param $unused i32)
 *           (result i32) … same loops; per entry:
 *       block  (br_if 0 (i64.ne (i64.and (i64.load offset=8k q) (i64.load offset=8k e)) (i64.load offset=8k q)))  … k = 0..31
 *              (i32.store (out + 4n) (i*64 + j)) (n += 1)
 *       end))
 */

const OP = {
  block: 0x02, loop: 0x03, if: 0x04, end: 0x0b, br: 0x0c, brIf: 0x0d, void: 0x40,
  localGet: 0x20, localSet: 0x21, i32Const: 0x41,
  i32Load: 0x28, i64Load: 0x29, i32Store: 0x36,
  i32GeU: 0x4f, i64Ne: 0x52, i32Add: 0x6a, i32Mul: 0x6c,
  i64And: 0x83, i64Popcnt: 0x7b, i64Add: 0x7c, i32WrapI64: 0xa7,
} as const;

function uleb(value: number): number[] {
  const out: number[] = [];
  let v = value >>> 0;
  do {
    const byte = v & 0x7f;
    v >>>= 7;
    out.push(v ? byte | 0x80 : byte);
  } while (v);
  return out;
}

/** i32.const with a small non-negative value (signed LEB128). */
const i32 = (value: number) => [OP.i32Const, ...sleb(value)];
function sleb(value: number): number[] {
  const out: number[] = [];
  let v = value | 0;
  for (;;) {
    const byte = v & 0x7f;
    v >>= 7;
    const done = (v === 0 && (byte & 0x40) === 0) || (v === -1 && (byte & 0x40) !== 0);
    out.push(done ? byte : byte | 0x80);
    if (done) return out;
  }
}
const get = (local: number) => [OP.localGet, local];
const set = (local: number) => [OP.localSet, local];
const load64 = (local: number, offset: number) => [...get(local), OP.i64Load, 3, ...uleb(offset)];
const inc = (local: number, by: number) => [...get(local), ...i32(by), OP.i32Add, ...set(local)];

// Locals: 0 q, 1 list, 2 chunks, 3 out, 4 cmin | 5 i, 6 j, 7 e, 8 count, 9 n, 10 s
const [Q, LIST, CHUNKS, OUT, CMIN, I, J, E, COUNT, N, S] = [0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10];
const WORDS = 32;

/** list[i] address → e, count; the chunk loop around `perEntry`. */
function chunkLoops(perEntry: number[]): number[] {
  return [
    OP.block, OP.void, OP.loop, OP.void,
    ...get(I), ...get(CHUNKS), OP.i32GeU, OP.brIf, 1,
    ...get(LIST), ...get(I), ...i32(8), OP.i32Mul, OP.i32Add, OP.i32Load, 2, 0, ...set(E),
    ...get(LIST), ...get(I), ...i32(8), OP.i32Mul, OP.i32Add, OP.i32Load, 2, 4, ...set(COUNT),
    ...i32(0), ...set(J),
    OP.block, OP.void, OP.loop, OP.void,
    ...get(J), ...get(COUNT), OP.i32GeU, OP.brIf, 1,
    ...perEntry,
    ...inc(J, 1), ...inc(E, 256), OP.br, 0,
    OP.end, OP.end,
    ...inc(I, 1), OP.br, 0,
    OP.end, OP.end,
    ...get(N),
  ];
}

/** i*64 + j */
const entryCode = () => [...get(I), ...i32(64), OP.i32Mul, ...get(J), OP.i32Add];

function similarityBody(): number[] {
  const sum: number[] = [];
  for (let k = 0; k < WORDS; k++) {
    sum.push(...load64(Q, 8 * k), ...load64(E, 8 * k), OP.i64And, OP.i64Popcnt);
    if (k > 0) sum.push(OP.i64Add);
  }
  const perEntry = [
    ...sum, OP.i32WrapI64, ...set(S),
    ...get(S), ...get(CMIN), OP.i32GeU, OP.if, OP.void,
    ...get(OUT), ...get(N), ...i32(8), OP.i32Mul, OP.i32Add, ...entryCode(), OP.i32Store, 2, 0,
    ...get(OUT), ...get(N), ...i32(8), OP.i32Mul, OP.i32Add, ...get(S), OP.i32Store, 2, 4,
    ...inc(N, 1),
    OP.end,
  ];
  return chunkLoops(perEntry);
}

function screenBody(): number[] {
  const checks: number[] = [];
  for (let k = 0; k < WORDS; k++) {
    checks.push(...load64(Q, 8 * k), ...load64(E, 8 * k), OP.i64And, ...load64(Q, 8 * k), OP.i64Ne, OP.brIf, 0);
  }
  const perEntry = [
    OP.block, OP.void,
    ...checks,
    ...get(OUT), ...get(N), ...i32(4), OP.i32Mul, OP.i32Add, ...entryCode(), OP.i32Store, 2, 0,
    ...inc(N, 1),
    OP.end,
  ];
  return chunkLoops(perEntry);
}

function section(id: number, payload: number[]): number[] {
  return [id, ...uleb(payload.length), ...payload];
}

function name(text: string): number[] {
  return [...uleb(text.length), ...Array.from(text, (c) => c.charCodeAt(0))];
}

function functionBody(code: number[]): number[] {
  // Six i32 locals after the five parameters.
  const body = [1, 6, 0x7f, ...code, OP.end];
  return [...uleb(body.length), ...body];
}

export function kernelBytes(): Uint8Array<ArrayBuffer> {
  const I32 = 0x7f;
  const types = section(1, [1, 0x60, 5, I32, I32, I32, I32, I32, 1, I32]);
  const imports = section(2, [1, ...name("env"), ...name("memory"), 0x02, 0x00, 1]);
  const functions = section(3, [2, 0, 0]);
  const exports = section(7, [2, ...name("similarity"), 0x00, 0, ...name("screen"), 0x00, 1]);
  const code = section(10, [2, ...functionBody(similarityBody()), ...functionBody(screenBody())]);
  return new Uint8Array([0x00, 0x61, 0x73, 0x6d, 0x01, 0x00, 0x00, 0x00, ...types, ...imports, ...functions, ...exports, ...code]);
}

export interface ScanKernel {
  /** Entries with |q ∧ e| ≥ cmin; writes [code, common] pairs at `out`; returns how many. */
  similarity(q: number, list: number, chunks: number, out: number, cmin: number): number;
  /** Entries containing every bit of q; writes codes at `out`; returns how many. */
  screen(q: number, list: number, chunks: number, out: number, unused: number): number;
}

let compiled: WebAssembly.Module | undefined;

export function instantiateKernel(memory: WebAssembly.Memory): ScanKernel {
  compiled ??= new WebAssembly.Module(kernelBytes());
  const instance = new WebAssembly.Instance(compiled, { env: { memory } });
  return instance.exports as unknown as ScanKernel;
}
