/**
 * Two scan kernels, assembled here byte by byte (no toolchain). Readable WebAssembly text of what is emitted
 * (the sliced kernel's $planes and $np parameters are kept for a stable signature and not used):
 *
 *   (module (import "env" "memory" (memory 1))
 *
 *   ;; Exact common-bit counts over bit-sliced ("transposed") fingerprints. A block holds 64 compounds; word
 *   ;; (k·S + t) of a super-chunk of S blocks holds bit k of the 64 compounds of block t, one compound per lane.
 *   ;; For each block, the query's set bits (u16 list at $qbits) are added lane-wise into 12 counter planes
 *   ;; (ripple carry: a plane is one bit of every lane's count), the planes are compared with $cmin bit by bit,
 *   ;; and every lane at or above it is written as [block·64 + lane, count]. Returns the number written.
 *   (func (export "sliced") (param $qbits $nbits $list $nsuper $out $cmin $planes $np i32) (result i32)
 *     for i < nsuper:  e = list + 16i;  base, shift, used, lanes = e[0], e[4], e[8], e[12]   ;; shift = 3 + log2 S
 *       for t < used  (base += 8 per block):
 *         P0 … P11 = 0                                   ;; 12 i64 locals, one bit of every lane's count each
 *         for k < nbits:  w = i64.load(base + (qbits[k] ≪ shift))
 *           if w ≠ 0: block (unrolled p = 0 … 11)  c = Pp ∧ w;  Pp = Pp ⊕ w;  w = c;  br_if 0 (w = 0)  end
 *           if k+1 = nbits/2 or k+1 = nbits − nbits/4:  need = cmin − (nbits − k − 1)
 *             if need > 0 and no lane has count ≥ need (atLeast below): skip this block
 *         atLeast(cmin): gt = 0; eq = −1;  for p = 11 … 0 (unrolled): if cmin bit p: eq ∧= Pp  else: gt ∨= eq ∧ Pp
 *         mask = gt ∨ eq;  if t = used−1 ∧ lanes < 64: mask ∧= 2^lanes − 1
 *         while mask ≠ 0:  j = ctz(mask);  count = Σp ((Pp ≫ j) ∧ 1) ≪ p
 *           out[n] = [g·64 + j, count];  n++;  mask ∧= mask − 1
 *         g++
 *     return n)
 *
 *   ;; Screening: writes i·64 + j for every entry e (256 bytes, 64 per chunk, list = [address, count] pairs)
 *   ;; that has all bits of q, i.e. (q ∧ e) = q word by word, leaving an entry at its first failing word.
 *   (func (export "screen") (param $q $list $chunks $out $unused i32) (result i32) …))
 */

const OP = {
  block: 0x02, loop: 0x03, if: 0x04, else: 0x05, end: 0x0b, br: 0x0c, brIf: 0x0d, void: 0x40,
  localGet: 0x20, localSet: 0x21, localTee: 0x22, i32Const: 0x41, i64Const: 0x42,
  i32Load: 0x28, i64Load: 0x29, i32Load16U: 0x2f, i32Store: 0x36, i64Store: 0x37,
  i32Eqz: 0x45, i32Eq: 0x46, i32LtU: 0x49, i32GtS: 0x4a, i32GeU: 0x4f, i64Eqz: 0x50, i64Ne: 0x52,
  i32Add: 0x6a, i32Sub: 0x6b, i32Mul: 0x6c, i32And: 0x71, i32Or: 0x72, i32Shl: 0x74, i32ShrU: 0x76,
  i64Ctz: 0x7a, i64Sub: 0x7d, i64And: 0x83, i64Or: 0x84, i64Xor: 0x85, i64Shl: 0x86, i64ShrU: 0x88,
  i32WrapI64: 0xa7, i64ExtendI32U: 0xad,
} as const;
const I32 = 0x7f;
const I64 = 0x7e;

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

const i32 = (value: number) => [OP.i32Const, ...sleb(value)];
const i64 = (value: number) => [OP.i64Const, ...sleb(value)];
const get = (local: number) => [OP.localGet, local];
const set = (local: number) => [OP.localSet, local];
const inc = (local: number, by = 1) => [...get(local), ...i32(by), OP.i32Add, ...set(local)];
/** block { loop { if (exit) break; body; continue } } */
const loop = (exit: number[], body: number[]) => [OP.block, OP.void, OP.loop, OP.void, ...exit, OP.brIf, 1, ...body, OP.br, 0, OP.end, OP.end];
const ifThen = (cond: number[], then: number[], otherwise?: number[]) => [...cond, OP.if, OP.void, ...then, ...(otherwise ? [OP.else, ...otherwise] : []), OP.end];
/** Counter planes live in 12 i64 locals: counts up to 4095, more than the 2048 bits of a fingerprint. */
const PLANE_COUNT = 12;

function slicedBody(): { locals: number[]; code: number[] } {
  // Parameters 0–7 (planes/np kept for the ABI, unused), i32 locals 8–22, i64 locals 23–27, planes 28–39.
  const [QBITS, NBITS, LIST, NSUPER, OUT, CMIN] = [0, 1, 2, 3, 4, 5];
  const [I, E, BASE, SHIFT, USED, LANES, T, K, N, G, J, CNT, ADDR, NEED, SKIP] = [8, 9, 10, 11, 12, 13, 14, 15, 16, 17, 18, 19, 20, 21, 22];
  const [W, TMP, GT, EQ, MASK] = [23, 24, 25, 26, 27];
  const plane = (p: number) => 28 + p;
  const range = (n: number) => Array.from({ length: n }, (_, p) => p);
  const zeroPlanes = range(PLANE_COUNT).flatMap((p) => [...i64(0), ...set(plane(p))]);
  // Ripple-carry add of w into the planes, leaving as soon as the carry is zero.
  const carryChain = [
    OP.block, OP.void,
    ...range(PLANE_COUNT).flatMap((p) => [
      ...get(plane(p)), ...get(W), OP.i64And, ...set(TMP),
      ...get(plane(p)), ...get(W), OP.i64Xor, ...set(plane(p)),
      ...get(TMP), OP.localTee, W, OP.i64Eqz, OP.brIf, 0,
    ]),
    OP.end,
  ];
  /** MASK = lanes whose count ≥ the i32 in local `limit` (bit-sliced comparison from the top plane down). */
  const atLeast = (limit: number) => [
    ...i64(0), ...set(GT), ...i64(-1), ...set(EQ),
    ...range(PLANE_COUNT).reverse().flatMap((p) => ifThen([...get(limit), ...i32(p), OP.i32ShrU, ...i32(1), OP.i32And],
      [...get(EQ), ...get(plane(p)), OP.i64And, ...set(EQ)],
      [...get(GT), ...get(EQ), ...get(plane(p)), OP.i64And, OP.i64Or, ...set(GT)])),
    ...get(GT), ...get(EQ), OP.i64Or, ...set(MASK),
  ];
  // After half and after three quarters of the bits: if no lane can still reach cmin with the bits left, stop.
  const checkpoint = ifThen(
    [...get(K), ...get(NBITS), ...i32(1), OP.i32ShrU, OP.i32Eq, ...get(K), ...get(NBITS), ...get(NBITS), ...i32(2), OP.i32ShrU, OP.i32Sub, OP.i32Eq, OP.i32Or],
    [
      ...get(CMIN), ...get(NBITS), ...get(K), OP.i32Sub, OP.i32Sub, OP.localTee, NEED, ...i32(0), OP.i32GtS,
      OP.if, OP.void,
      ...atLeast(NEED),
      // Depth: this if (0), the checkpoint if (1), the loop (2), the bits block (3).
      ...get(MASK), OP.i64Eqz, OP.if, OP.void, ...i32(1), ...set(SKIP), OP.br, 4, OP.end,
      OP.end,
    ],
  );
  const addBits = [
    ...i32(0), ...set(K), ...i32(0), ...set(SKIP),
    ...loop([...get(K), ...get(NBITS), OP.i32GeU], [
      // w = word(base + (qbits[k] << shift)), base already offset to block t
      ...get(BASE), ...get(QBITS), ...get(K), ...i32(1), OP.i32Shl, OP.i32Add, OP.i32Load16U, 1, 0, ...get(SHIFT), OP.i32Shl, OP.i32Add,
      OP.i64Load, 3, 0, OP.localTee, W,
      OP.i64Eqz, OP.i32Eqz, OP.if, OP.void, ...carryChain, OP.end,
      ...inc(K),
      ...checkpoint,
    ]),
  ];
  const lanesMask = ifThen([...get(T), ...get(USED), ...i32(1), OP.i32Sub, OP.i32Eq, ...get(LANES), ...i32(64), OP.i32LtU, OP.i32And],
    [...get(MASK), ...i64(1), ...get(LANES), OP.i64ExtendI32U, OP.i64Shl, ...i64(1), OP.i64Sub, OP.i64And, ...set(MASK)]);
  const emit = loop([...get(MASK), OP.i64Eqz], [
    ...get(MASK), OP.i64Ctz, OP.i32WrapI64, ...set(J),
    ...i32(0), ...set(CNT),
    ...range(PLANE_COUNT).flatMap((p) => [
      ...get(CNT), ...get(plane(p)), ...get(J), OP.i64ExtendI32U, OP.i64ShrU, ...i64(1), OP.i64And, OP.i32WrapI64,
      ...i32(p), OP.i32Shl, OP.i32Or, ...set(CNT),
    ]),
    ...get(OUT), ...get(N), ...i32(3), OP.i32Shl, OP.i32Add, OP.localTee, ADDR, ...get(G), ...i32(6), OP.i32Shl, ...get(J), OP.i32Add, OP.i32Store, 2, 0,
    ...get(ADDR), ...get(CNT), OP.i32Store, 2, 4,
    ...inc(N),
    ...get(MASK), ...get(MASK), ...i64(1), OP.i64Sub, OP.i64And, ...set(MASK),
  ]);
  const perBlock = [
    ...zeroPlanes, ...addBits,
    ...ifThen([...get(SKIP), OP.i32Eqz], [...atLeast(CMIN), ...lanesMask, ...emit]),
    ...inc(BASE, 8), ...inc(G), ...inc(T),
  ];
  const code = [
    ...loop([...get(I), ...get(NSUPER), OP.i32GeU], [
      ...get(LIST), ...get(I), ...i32(4), OP.i32Shl, OP.i32Add, OP.localTee, E, OP.i32Load, 2, 0, ...set(BASE),
      ...get(E), OP.i32Load, 2, 4, ...set(SHIFT),
      ...get(E), OP.i32Load, 2, 8, ...set(USED),
      ...get(E), OP.i32Load, 2, 12, ...set(LANES),
      ...i32(0), ...set(T),
      ...loop([...get(T), ...get(USED), OP.i32GeU], perBlock),
      ...inc(I),
    ]),
    ...get(N),
  ];
  return { locals: [2, 15, I32, 5 + PLANE_COUNT, I64], code };
}

function screenBody(): { locals: number[]; code: number[] } {
  const [Q, LIST, CHUNKS, OUT] = [0, 1, 2, 3];
  const [I, J, E, COUNT, N] = [5, 6, 7, 8, 9];
  const checks: number[] = [];
  for (let k = 0; k < 32; k++) {
    const word = (local: number) => [...get(local), OP.i64Load, 3, ...uleb(8 * k)];
    checks.push(...word(Q), ...word(E), OP.i64And, ...word(Q), OP.i64Ne, OP.brIf, 0);
  }
  const code = [
    ...loop([...get(I), ...get(CHUNKS), OP.i32GeU], [
      ...get(LIST), ...get(I), ...i32(3), OP.i32Shl, OP.i32Add, OP.i32Load, 2, 0, ...set(E),
      ...get(LIST), ...get(I), ...i32(3), OP.i32Shl, OP.i32Add, OP.i32Load, 2, 4, ...set(COUNT),
      ...i32(0), ...set(J),
      ...loop([...get(J), ...get(COUNT), OP.i32GeU], [
        OP.block, OP.void, ...checks,
        ...get(OUT), ...get(N), ...i32(2), OP.i32Shl, OP.i32Add, ...get(I), ...i32(6), OP.i32Shl, ...get(J), OP.i32Add, OP.i32Store, 2, 0,
        ...inc(N),
        OP.end,
        ...inc(J), ...inc(E, 256),
      ]),
      ...inc(I),
    ]),
    ...get(N),
  ];
  return { locals: [1, 5, I32], code };
}

function section(id: number, payload: number[]): number[] {
  return [id, ...uleb(payload.length), ...payload];
}

function name(text: string): number[] {
  return [...uleb(text.length), ...Array.from(text, (c) => c.charCodeAt(0))];
}

function functionBody({ locals, code }: { locals: number[]; code: number[] }): number[] {
  const body = [...locals, ...code, OP.end];
  return [...uleb(body.length), ...body];
}

export function kernelBytes(): Uint8Array<ArrayBuffer> {
  const types = section(1, [2, 0x60, 8, ...Array<number>(8).fill(I32), 1, I32, 0x60, 5, ...Array<number>(5).fill(I32), 1, I32]);
  const imports = section(2, [1, ...name("env"), ...name("memory"), 0x02, 0x00, 1]);
  const functions = section(3, [2, 0, 1]);
  const exports = section(7, [2, ...name("sliced"), 0x00, 0, ...name("screen"), 0x00, 1]);
  const code = section(10, [2, ...functionBody(slicedBody()), ...functionBody(screenBody())]);
  return new Uint8Array([0x00, 0x61, 0x73, 0x6d, 0x01, 0x00, 0x00, 0x00, ...types, ...imports, ...functions, ...exports, ...code]);
}

export interface ScanKernel {
  /** Lanes with at least `cmin` of the query's bits; writes [block·64 + lane, count] pairs at `out`; returns how many. */
  sliced(qbits: number, nbits: number, list: number, nsuper: number, out: number, cmin: number, planes: number, np: number): number;
  /** Entries containing every bit of q; writes codes at `out`; returns how many. */
  screen(q: number, list: number, chunks: number, out: number, unused: number): number;
}

let compiled: WebAssembly.Module | undefined;

export function instantiateKernel(memory: WebAssembly.Memory): ScanKernel {
  compiled ??= new WebAssembly.Module(kernelBytes());
  const instance = new WebAssembly.Instance(compiled, { env: { memory } });
  return instance.exports as unknown as ScanKernel;
}
