/**
 * Eigenvalues and eigenvectors of a real symmetric tridiagonal matrix by the implicit QL
 * method with Wilkinson-type shifts (the EISPACK routine tql2: Bowdler, Martin, Reinsch &
 * Wilkinson 1968, Numer. Math. 11, 293–306; Wilkinson & Reinsch, Handbook for Automatic
 * Computation II, 1971, contribution II/3). `diagonal` (n) and `offDiagonal` (n; entry i is
 * T[i][i−1], entry 0 unused) are overwritten: on return `diagonal` holds the eigenvalues in
 * ascending order. `vectors` (n × n, row-major) is multiplied from the right by the rotations
 * and its columns permuted with the eigenvalues: start it at the identity for the eigenvectors
 * of T, or at the matrix that reduced a full matrix to T for that matrix's eigenvectors.
 */
export function tridiagonalEigen(diagonal: Float64Array, offDiagonal: Float64Array, vectors: Float64Array): void {
  const n = diagonal.length
  if (offDiagonal.length !== n || vectors.length !== n * n) throw new RangeError('tridiagonalEigen needs n diagonal and off-diagonal entries and an n × n matrix')
  const d = diagonal
  const e = offDiagonal
  const z = vectors
  for (let i = 1; i < n; i++) e[i - 1] = e[i]!
  if (n > 0) e[n - 1] = 0
  const eps = 2 ** -52
  let f = 0
  let tst1 = 0
  for (let l = 0; l < n; l++) {
    tst1 = Math.max(tst1, Math.abs(d[l]!) + Math.abs(e[l]!))
    let m = l
    while (m < n - 1 && Math.abs(e[m]!) > eps * tst1) m++
    if (m > l) {
      let iterations = 0
      do {
        if (++iterations > 60) throw new RangeError('tridiagonalEigen did not converge')
        let g = d[l]!
        let p = (d[l + 1]! - g) / (2 * e[l]!)
        let r = Math.hypot(p, 1)
        if (p < 0) r = -r
        d[l] = e[l]! / (p + r)
        d[l + 1] = e[l]! * (p + r)
        const dl1 = d[l + 1]!
        let h = g - d[l]!
        for (let i = l + 2; i < n; i++) d[i]! -= h
        f += h
        p = d[m]!
        let c = 1
        let c2 = c
        let c3 = c
        const el1 = e[l + 1]!
        let s = 0
        let s2 = 0
        for (let i = m - 1; i >= l; i--) {
          c3 = c2
          c2 = c
          s2 = s
          g = c * e[i]!
          h = c * p
          r = Math.hypot(p, e[i]!)
          e[i + 1] = s * r
          s = e[i]! / r
          c = p / r
          p = c * d[i]! - s * g
          d[i + 1] = h + s * (c * g + s * d[i]!)
          for (let k = 0; k < n; k++) {
            const row = k * n
            h = z[row + i + 1]!
            z[row + i + 1] = s * z[row + i]! + c * h
            z[row + i] = c * z[row + i]! - s * h
          }
        }
        p = (-s * s2 * c3 * el1 * e[l]!) / dl1
        e[l] = s * p
        d[l] = c * p
      } while (Math.abs(e[l]!) > eps * tst1)
    }
    d[l] = d[l]! + f
    e[l] = 0
  }
  // Ascending order, columns with them (selection sort: n is small).
  for (let i = 0; i < n - 1; i++) {
    let k = i
    for (let j = i + 1; j < n; j++) if (d[j]! < d[k]!) k = j
    if (k === i) continue
    const t = d[k]!
    d[k] = d[i]!
    d[i] = t
    for (let row = 0; row < n * n; row += n) {
      const v = z[row + i]!
      z[row + i] = z[row + k]!
      z[row + k] = v
    }
  }
}
