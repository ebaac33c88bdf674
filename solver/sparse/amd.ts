// Approximate minimum degree ordering on a quotient graph (the method of Amestoy, Davis and Duff, 1996):
// element absorption, aggressive absorption, supervariables found by hashing, mass elimination, dense rows last.
import type { AdjacencyGraph } from './adjacency';
import { compressIndistinguishable } from './indistinguishable';

const VARIABLE = 0;
const ELEMENT = 1;
const GONE = 2; // absorbed element, merged or mass-eliminated variable, dense row, or compressed-away node

export interface AmdOptions {
  /** A node with more than max(16, denseFactor·√n) neighbours is ordered last and kept out of the graph. */
  denseFactor?: number;
}

export interface AmdResult {
  /** order[k] = the node eliminated k-th. */
  order: Int32Array;
  /** Representative of each node's initial group of indistinguishable nodes (itself when alone or dense). */
  principal: Int32Array;
  /** Dense rows found (ordered last, each its own group). */
  denseCount: number;
}

/** Returns order[k] = the node eliminated k-th. */
export function approximateMinimumDegree(g: AdjacencyGraph, options: AmdOptions = {}): Int32Array {
  return amdWithGroups(g, options).order;
}

/** The ordering plus the initial groups, which are contiguous in it (the analysis counts fill per group). */
export function amdWithGroups(g: AdjacencyGraph, options: AmdOptions = {}): AmdResult {
  const n = g.n;
  const order = new Int32Array(n);
  if (n === 0) return { order, principal: new Int32Array(0), denseCount: 0 };
  const denseLimit = Math.max(16, (options.denseFactor ?? 10) * Math.sqrt(n));

  const dense = new Uint8Array(n);
  let denseCount = 0;
  for (let i = 0; i < n; i++) {
    if (g.ptr[i + 1] - g.ptr[i] > denseLimit) {
      dense[i] = 1;
      denseCount++;
    }
  }
  const { principal, weight } = compressIndistinguishable(g, dense);

  const kind = new Uint8Array(n).fill(GONE);
  const start = new Int32Array(n);
  const len = new Int32Array(n);
  const elen = new Int32Array(n); // leading entries of a variable's list that are elements
  const nv = new Int32Array(n); // supervariable weight; negated while the variable sits in the pivot's element
  const degree = new Int32Array(n); // approximate external degree (variables) or |L_e| weighted (elements)
  const w = new Int32Array(n); // |L_e \ L_p| + wflg during one pivot step
  const memberNext = new Int32Array(n).fill(-1);
  const memberTail = new Int32Array(n);
  for (let i = 0; i < n; i++) memberTail[i] = i;

  // Chain each compressed group behind its representative so the group is ordered together.
  for (let i = 0; i < n; i++) {
    const r = principal[i];
    if (r !== i) {
      memberNext[memberTail[r]] = i;
      memberTail[r] = i;
    }
  }

  // Quotient graph lists in one pool; the first elen[i] entries of a variable are elements, the rest variables.
  let liveWeight = 0;
  let poolUsed = 0;
  for (let i = 0; i < n; i++) {
    if (!dense[i] && principal[i] === i) poolUsed += g.ptr[i + 1] - g.ptr[i];
  }
  let pool = new Int32Array(Math.max(1024, Math.ceil(poolUsed * 1.5) + 2 * n));
  let pfree = 0;
  for (let i = 0; i < n; i++) {
    if (dense[i] || principal[i] !== i) continue;
    kind[i] = VARIABLE;
    nv[i] = weight[i];
    liveWeight += weight[i];
    start[i] = pfree;
    let d = 0;
    for (let p = g.ptr[i]; p < g.ptr[i + 1]; p++) {
      const j = g.adj[p];
      if (dense[j] || principal[j] !== j) continue; // each neighbouring group once, through its representative
      pool[pfree++] = j;
      d += weight[j];
    }
    len[i] = pfree - start[i];
    degree[i] = d;
  }

  // Degree buckets: doubly linked lists.
  const head = new Int32Array(n + 1).fill(-1);
  const next = new Int32Array(n).fill(-1);
  const prev = new Int32Array(n).fill(-1);
  let minDegree = n;
  const insert = (i: number, d: number): void => {
    degree[i] = d;
    const h = head[d];
    next[i] = h;
    prev[i] = -1;
    if (h !== -1) prev[h] = i;
    head[d] = i;
    if (d < minDegree) minDegree = d;
  };
  const remove = (i: number): void => {
    const a = prev[i];
    const b = next[i];
    if (a !== -1) next[a] = b;
    else head[degree[i]] = b;
    if (b !== -1) prev[b] = a;
  };
  for (let i = 0; i < n; i++) if (kind[i] === VARIABLE) insert(i, degree[i]);

  let ordered = 0;
  const emit = (i: number): void => {
    for (let m = i; m !== -1; m = memberNext[m]) order[ordered++] = m;
  };

  // Free-space management: copy live lists into a fresh pool (never in the middle of reading one).
  const collect = (needed: number): void => {
    let used = 0;
    for (let i = 0; i < n; i++) if (kind[i] !== GONE) used += len[i];
    const size = Math.max(pool.length, Math.ceil(used * 1.5) + needed + 1024);
    const fresh = new Int32Array(size);
    let pos = 0;
    for (let i = 0; i < n; i++) {
      if (kind[i] === GONE) continue;
      fresh.set(pool.subarray(start[i], start[i] + len[i]), pos);
      start[i] = pos;
      pos += len[i];
    }
    pool = fresh;
    pfree = pos;
  };

  const hashHead = new Int32Array(n).fill(-1);
  const hashNext = new Int32Array(n);
  const hashOf = new Int32Array(n);
  const mark = new Int32Array(n);
  let tag = 0;
  let wflg = 1;
  let maxElementDegree = 0;
  let eliminated = 0;

  while (eliminated < liveWeight) {
    // 1. The pivot: a variable of least approximate degree.
    while (head[minDegree] === -1) minDegree++;
    const p = head[minDegree];
    remove(p);
    let pivotWeight = nv[p];
    emit(p);

    // 2. The new element L_p = (A_p ∪ the L_e of every element e in E_p) \ p; those elements are absorbed.
    let bound = len[p] - elen[p];
    for (let t = start[p]; t < start[p] + elen[p]; t++) {
      const e = pool[t];
      if (kind[e] === ELEMENT) bound += len[e];
    }
    if (pfree + bound > pool.length) collect(bound);
    kind[p] = ELEMENT;
    const lpStart = pfree;
    const pEnd = start[p] + len[p];
    for (let t = start[p]; t < pEnd; t++) {
      const e = pool[t];
      const isElement = t < start[p] + elen[p];
      if (isElement) {
        if (kind[e] !== ELEMENT) continue;
        for (let s = start[e]; s < start[e] + len[e]; s++) {
          const i = pool[s];
          if (kind[i] !== VARIABLE || nv[i] <= 0) continue;
          nv[i] = -nv[i];
          pool[pfree++] = i;
          remove(i);
        }
        kind[e] = GONE;
      } else if (kind[e] === VARIABLE && nv[e] > 0) {
        nv[e] = -nv[e];
        pool[pfree++] = e;
        remove(e);
      }
    }
    const lpEnd = pfree;
    start[p] = lpStart;
    len[p] = lpEnd - lpStart;
    elen[p] = 0;
    eliminated += pivotWeight;

    // 3. w(e) - wflg = |L_e \ L_p| for every element next to the new one.
    for (let t = lpStart; t < lpEnd; t++) {
      const i = pool[t];
      const nvi = -nv[i];
      for (let s = start[i]; s < start[i] + elen[i]; s++) {
        const e = pool[s];
        if (kind[e] !== ELEMENT) continue;
        const we = w[e];
        w[e] = we >= wflg ? we - nvi : degree[e] + wflg - nvi;
      }
    }

    // 4. Prune each variable's lists, absorb elements inside L_p, bound its degree, hash it.
    for (let t = lpStart; t < lpEnd; t++) {
      const i = pool[t];
      const nvi = -nv[i];
      const s0 = start[i];
      const eEnd = s0 + elen[i];
      const vEnd = s0 + len[i];
      let out = s0;
      let partial = 0;
      let hash = 0;
      for (let s = s0; s < eEnd; s++) {
        const e = pool[s];
        if (kind[e] !== ELEMENT) continue;
        const external = w[e] - wflg;
        if (external > 0) {
          partial += external;
          hash += e;
          pool[out++] = e;
        } else {
          kind[e] = GONE; // aggressive absorption: L_e lies inside L_p
        }
      }
      const elements = out - s0;
      for (let s = eEnd; s < vEnd; s++) {
        const j = pool[s];
        if (kind[j] !== VARIABLE || nv[j] <= 0) continue; // gone, the pivot, or covered by L_p
        partial += nv[j];
        hash += j;
        pool[out++] = j;
      }
      const variables = out - s0 - elements;
      // p joins the element section; the list lost at least p-as-variable or an absorbed element, so it fits.
      if (out >= vEnd) throw new Error('approximate minimum degree: internal list overflow');
      if (variables > 0) pool[out] = pool[s0 + elements];
      pool[s0 + elements] = p;
      len[i] = elements + variables + 1;
      elen[i] = elements + 1;

      if (elements === 0 && variables === 0) {
        // Mass elimination: i touches nothing but the new element, so it goes with p at no cost.
        kind[i] = GONE;
        pivotWeight += nvi;
        eliminated += nvi;
        nv[i] = 0;
        emit(i);
        continue;
      }
      if (partial < degree[i]) degree[i] = partial;
      const h = hash % n;
      hashOf[i] = h;
      hashNext[i] = hashHead[h];
      hashHead[h] = i;
    }

    // 5. Supervariables: variables of L_p with equal lists merge (compared as sets within a hash bucket).
    for (let t = lpStart; t < lpEnd; t++) {
      const first = pool[t];
      if (kind[first] !== VARIABLE) continue;
      const h = hashOf[first];
      let a = hashHead[h];
      if (a === -1) continue;
      hashHead[h] = -1;
      for (; a !== -1; a = hashNext[a]) {
        if (kind[a] !== VARIABLE) continue;
        let marked = false;
        let prevB = a;
        for (let b = hashNext[a]; b !== -1; b = hashNext[b]) {
          if (kind[b] !== VARIABLE || len[b] !== len[a] || elen[b] !== elen[a]) {
            prevB = b;
            continue;
          }
          if (!marked) {
            if (++tag === 0x7fffffff) {
              mark.fill(0);
              tag = 1;
            }
            for (let s = start[a]; s < start[a] + len[a]; s++) mark[pool[s]] = tag;
            marked = true;
          }
          let same = true;
          for (let s = start[b]; s < start[b] + len[b]; s++) {
            if (mark[pool[s]] !== tag) {
              same = false;
              break;
            }
          }
          if (!same) {
            prevB = b;
            continue;
          }
          nv[a] += nv[b]; // both negative while flagged
          nv[b] = 0;
          kind[b] = GONE;
          memberNext[memberTail[a]] = b;
          memberTail[a] = memberTail[b];
          hashNext[prevB] = hashNext[b];
        }
      }
    }

    // 6. Final degrees; compact L_p to its surviving variables.
    let finalDegme = 0;
    for (let t = lpStart; t < lpEnd; t++) {
      const i = pool[t];
      if (kind[i] === VARIABLE) finalDegme -= nv[i];
    }
    let out = lpStart;
    for (let t = lpStart; t < lpEnd; t++) {
      const i = pool[t];
      if (kind[i] !== VARIABLE) continue;
      const nvi = -nv[i];
      nv[i] = nvi;
      const d = Math.min(degree[i] + finalDegme - nvi, liveWeight - eliminated - nvi);
      insert(i, d);
      pool[out++] = i;
    }
    len[p] = out - lpStart;
    pfree = out;
    degree[p] = finalDegme;
    nv[p] = pivotWeight;

    if (finalDegme > maxElementDegree) maxElementDegree = finalDegme;
    wflg += maxElementDegree + 1;
    if (wflg > 0x3fffffff - n) {
      w.fill(0);
      wflg = 1;
    }
  }

  for (let i = 0; i < n; i++) if (dense[i]) order[ordered++] = i;
  if (ordered !== n) throw new Error(`approximate minimum degree: ordered ${ordered} of ${n} nodes`);
  return { order, principal, denseCount };
}
