// Orthonormal polynomial basis over the fit points, used to project the free-sign baseline out of the mixture fit.

/** The basis vectors q (1, u, …, u^degree made orthonormal) and R with P = Q·R (row-major, (degree+1)²). */
export interface PolynomialBasis {
  q: Float64Array[];
  r: Float64Array;
}

/** Modified Gram–Schmidt of 1, u, …, u^degree; u is the scaled wavenumber of each fit point. */
export function polynomialBasis(u: Float64Array, degree: number): PolynomialBasis {
  const m = degree + 1;
  const q: Float64Array[] = [];
  const r = new Float64Array(m * m);
  for (let j = 0; j < m; j++) {
    const v = Float64Array.from(u, (x) => x ** j);
    for (let i = 0; i < j; i++) {
      const qi = q[i]!;
      let dot = 0;
      for (let t = 0; t < v.length; t++) dot += qi[t]! * v[t]!;
      r[i * m + j] = dot;
      for (let t = 0; t < v.length; t++) v[t] = v[t]! - dot * qi[t]!;
    }
    let norm = 0;
    for (let t = 0; t < v.length; t++) norm += v[t]! * v[t]!;
    norm = Math.sqrt(norm);
    r[j * m + j] = norm;
    for (let t = 0; t < v.length; t++) v[t] = v[t]! / norm;
    q.push(v);
  }
  return { q, r };
}
