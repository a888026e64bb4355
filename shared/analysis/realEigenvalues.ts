/** Eigenvalues of a real square matrix: λ_k = re[k] + i·im[k] (complex ones in conjugate pairs). */
export interface Eigenvalues {
  re: Float64Array
  im: Float64Array
}

/** Most QR sweeps for one eigenvalue (or pair) before the iteration is given up (LAPACK allows 30 per eigenvalue). */
const MAX_SWEEPS = 60

/**
 * Eigenvalues of a real n × n matrix (row by row): reduction to upper Hessenberg form by
 * Householder reflections, then Francis double-shift QR with deflation and exceptional shifts
 * (Golub & Van Loan, Matrix Computations, 4th ed., §7.4–7.5). The steps are JAMA's orthes and
 * hqr2 (public domain; as ml-matrix 6.15, MIT, ships them) without the eigenvectors, and with
 * the one thing they lack: a limit on the sweeps. Their loop has none, and a 6 × 6 pencil
 * matrix of a vibraphone's tremolo band kept it turning for good; here that throws a RangeError,
 * which the estimator's callers treat as a band that cannot be read.
 */
export function realEigenvalues(matrix: Float64Array, n: number): Eigenvalues {
  if (!(Number.isInteger(n) && n >= 1) || matrix.length !== n * n) throw new RangeError('realEigenvalues needs an n × n matrix, row by row')
  if (!matrix.every(Number.isFinite)) throw new RangeError('realEigenvalues needs finite entries')
  const h = Float64Array.from(matrix)
  toHessenberg(h, n)
  return hessenbergEigenvalues(h, n)
}

/** Householder reduction to upper Hessenberg form, in place (JAMA orthes, without the transformation). */
function toHessenberg(h: Float64Array, n: number): void {
  const ort = new Float64Array(n)
  const high = n - 1
  for (let m = 1; m <= high - 1; m++) {
    let scale = 0
    for (let i = m; i <= high; i++) scale += Math.abs(h[i * n + m - 1]!)
    if (scale === 0) continue
    let sum = 0
    for (let i = high; i >= m; i--) {
      ort[i] = h[i * n + m - 1]! / scale
      sum += ort[i]! * ort[i]!
    }
    let g = Math.sqrt(sum)
    if (ort[m]! > 0) g = -g
    sum -= ort[m]! * g
    ort[m] = ort[m]! - g
    for (let j = m; j < n; j++) {
      let f = 0
      for (let i = high; i >= m; i--) f += ort[i]! * h[i * n + j]!
      f /= sum
      for (let i = m; i <= high; i++) h[i * n + j]! -= f * ort[i]!
    }
    for (let i = 0; i <= high; i++) {
      let f = 0
      for (let j = high; j >= m; j--) f += ort[j]! * h[i * n + j]!
      f /= sum
      for (let j = m; j <= high; j++) h[i * n + j]! -= f * ort[j]!
    }
    ort[m] = scale * ort[m]!
    h[m * n + m - 1] = scale * g
  }
}

/** Eigenvalues of an upper Hessenberg matrix by Francis double-shift QR (JAMA hqr2's first part), destroying it. */
function hessenbergEigenvalues(h: Float64Array, nn: number): Eigenvalues {
  const d = new Float64Array(nn)
  const e = new Float64Array(nn)
  const at = (i: number, j: number) => h[i * nn + j]!
  const set = (i: number, j: number, v: number) => {
    h[i * nn + j] = v
  }
  const eps = Number.EPSILON
  let norm = 0
  for (let i = 0; i < nn; i++) for (let j = Math.max(i - 1, 0); j < nn; j++) norm += Math.abs(at(i, j))
  let n = nn - 1
  let exshift = 0
  let iter = 0
  let s = 0
  while (n >= 0) {
    let l = n
    while (l > 0) {
      s = Math.abs(at(l - 1, l - 1)) + Math.abs(at(l, l))
      if (s === 0) s = norm
      if (Math.abs(at(l, l - 1)) < eps * s) break
      l--
    }
    if (l === n) {
      // One real eigenvalue.
      set(n, n, at(n, n) + exshift)
      d[n] = at(n, n)
      e[n] = 0
      n--
      iter = 0
    }
    else if (l === n - 1) {
      // A 2 × 2 block: two real eigenvalues or a complex pair.
      const w = at(n, n - 1) * at(n - 1, n)
      const p = (at(n - 1, n - 1) - at(n, n)) / 2
      const q = p * p + w
      let z = Math.sqrt(Math.abs(q))
      set(n, n, at(n, n) + exshift)
      set(n - 1, n - 1, at(n - 1, n - 1) + exshift)
      const x = at(n, n)
      if (q >= 0) {
        z = p >= 0 ? p + z : p - z
        d[n - 1] = x + z
        d[n] = d[n - 1]!
        if (z !== 0) d[n] = x - w / z
        e[n - 1] = 0
        e[n] = 0
      }
      else {
        d[n - 1] = x + p
        d[n] = x + p
        e[n - 1] = z
        e[n] = -z
      }
      n -= 2
      iter = 0
    }
    else {
      if (iter >= MAX_SWEEPS) throw new RangeError('realEigenvalues did not converge')
      let x = at(n, n)
      let y = 0
      let w = 0
      if (l < n) {
        y = at(n - 1, n - 1)
        w = at(n, n - 1) * at(n - 1, n)
      }
      // Exceptional shifts at sweeps 10 and 30 (Wilkinson's ad hoc shifts, as JAMA).
      if (iter === 10) {
        exshift += x
        for (let i = 0; i <= n; i++) set(i, i, at(i, i) - x)
        s = Math.abs(at(n, n - 1)) + Math.abs(at(n - 1, n - 2))
        x = y = 0.75 * s
        w = -0.4375 * s * s
      }
      if (iter === 30) {
        s = (y - x) / 2
        s = s * s + w
        if (s > 0) {
          s = Math.sqrt(s)
          if (y < x) s = -s
          s = x - w / ((y - x) / 2 + s)
          for (let i = 0; i <= n; i++) set(i, i, at(i, i) - s)
          exshift += s
          x = y = w = 0.964
        }
      }
      iter++
      francisSweep(h, nn, n, l, x, y, w)
    }
  }
  return { re: d, im: e }
}

/** One Francis double-shift QR sweep over rows l…n of the Hessenberg matrix, shifts from x, y, w (JAMA hqr2). */
function francisSweep(h: Float64Array, nn: number, n: number, l: number, x: number, y: number, w: number): void {
  const at = (i: number, j: number) => h[i * nn + j]!
  const set = (i: number, j: number, v: number) => {
    h[i * nn + j] = v
  }
  const eps = Number.EPSILON
  let p = 0
  let q = 0
  let r = 0
  let s: number
  let z: number
  // Look for two consecutive small subdiagonal elements.
  let m = n - 2
  while (m >= l) {
    z = at(m, m)
    r = x - z
    s = y - z
    p = (r * s - w) / at(m + 1, m) + at(m, m + 1)
    q = at(m + 1, m + 1) - z - r - s
    r = at(m + 2, m + 1)
    s = Math.abs(p) + Math.abs(q) + Math.abs(r)
    p /= s
    q /= s
    r /= s
    if (m === l) break
    if (Math.abs(at(m, m - 1)) * (Math.abs(q) + Math.abs(r)) < eps * (Math.abs(p) * (Math.abs(at(m - 1, m - 1)) + Math.abs(z) + Math.abs(at(m + 1, m + 1))))) break
    m--
  }
  for (let i = m + 2; i <= n; i++) {
    set(i, i - 2, 0)
    if (i > m + 2) set(i, i - 3, 0)
  }
  // The double QR step on rows l…n and columns m…n.
  for (let k = m; k <= n - 1; k++) {
    const notlast = k !== n - 1
    if (k !== m) {
      p = at(k, k - 1)
      q = at(k + 1, k - 1)
      r = notlast ? at(k + 2, k - 1) : 0
      x = Math.abs(p) + Math.abs(q) + Math.abs(r)
      if (x !== 0) {
        p /= x
        q /= x
        r /= x
      }
    }
    if (x === 0) break
    s = Math.sqrt(p * p + q * q + r * r)
    if (p < 0) s = -s
    if (s === 0) continue
    if (k !== m) set(k, k - 1, -s * x)
    else if (l !== m) set(k, k - 1, -at(k, k - 1))
    p += s
    x = p / s
    y = q / s
    z = r / s
    q /= p
    r /= p
    for (let j = k; j < nn; j++) {
      p = at(k, j) + q * at(k + 1, j)
      if (notlast) {
        p += r * at(k + 2, j)
        set(k + 2, j, at(k + 2, j) - p * z)
      }
      set(k, j, at(k, j) - p * x)
      set(k + 1, j, at(k + 1, j) - p * y)
    }
    for (let i = 0; i <= Math.min(n, k + 3); i++) {
      p = x * at(i, k) + y * at(i, k + 1)
      if (notlast) {
        p += z * at(i, k + 2)
        set(i, k + 2, at(i, k + 2) - p * r)
      }
      set(i, k, at(i, k) - p)
      set(i, k + 1, at(i, k + 1) - p * q)
    }
  }
}
