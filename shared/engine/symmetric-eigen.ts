/**
 * Eigenvalues and eigenvectors of a real symmetric matrix: Householder reduction to tridiagonal form (tred2) and the
 * implicit QL method (tql2), from EISPACK via the public-domain JAMA package, in the form used by ml-matrix's
 * EigenvalueDecomposition (MIT licence, © 2014 Michaël Zasso), rewritten on a flat Float64Array so that the hot loops
 * index memory directly. The eigenvector matrix is stored transposed (v[j·n + i] holds component i of vector j), so
 * the inner loops run along contiguous rows.
 */

/**
 * Symmetric eigen-decomposition of the row-major n×n matrix `a` (only read). Returns the eigenvalues ascending and
 * the eigenvectors as rows of `vectors` (vectors[j·n + i] = component i of eigenvector j), orthonormal.
 */
export function symmetricEigen(a: Float64Array, n: number): { values: Float64Array; vectors: Float64Array } {
  const v = new Float64Array(n * n);
  // Transposed storage: v[j·n + i] = V(i, j); A is symmetric so this is a plain copy.
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) v[j * n + i] = a[i * n + j];
  const d = new Float64Array(n);
  const e = new Float64Array(n);
  if (n === 1) {
    d[0] = a[0];
    v[0] = 1;
    return { values: d, vectors: v };
  }
  tred2(n, e, d, v);
  tql2(n, e, d, v);
  return { values: d, vectors: v };
}

function hypotenuse(a: number, b: number): number {
  if (Math.abs(a) > Math.abs(b)) {
    const r = b / a;
    return Math.abs(a) * Math.sqrt(1 + r * r);
  }
  if (b !== 0) {
    const r = a / b;
    return Math.abs(b) * Math.sqrt(1 + r * r);
  }
  return 0;
}

function tred2(n: number, e: Float64Array, d: Float64Array, v: Float64Array): void {
  let f: number, g: number, h: number, i: number, j: number, k: number, hh: number, scale: number;

  for (j = 0; j < n; j++) {
    d[j] = v[(j) * n + (n - 1)];
  }

  for (i = n - 1; i > 0; i--) {
    scale = 0;
    h = 0;
    for (k = 0; k < i; k++) {
      scale = scale + Math.abs(d[k]);
    }

    if (scale === 0) {
      e[i] = d[i - 1];
      for (j = 0; j < i; j++) {
        d[j] = v[(j) * n + (i - 1)];
        v[(j) * n + (i)] = 0;
        v[(i) * n + (j)] = 0;
      }
    } else {
      for (k = 0; k < i; k++) {
        d[k] /= scale;
        h += d[k] * d[k];
      }

      f = d[i - 1];
      g = Math.sqrt(h);
      if (f > 0) {
        g = -g;
      }

      e[i] = scale * g;
      h = h - f * g;
      d[i - 1] = f - g;
      for (j = 0; j < i; j++) {
        e[j] = 0;
      }

      for (j = 0; j < i; j++) {
        f = d[j];
        v[(i) * n + (j)] = f;
        g = e[j] + v[(j) * n + (j)] * f;
        for (k = j + 1; k <= i - 1; k++) {
          g += v[(j) * n + (k)] * d[k];
          e[k] += v[(j) * n + (k)] * f;
        }
        e[j] = g;
      }

      f = 0;
      for (j = 0; j < i; j++) {
        e[j] /= h;
        f += e[j] * d[j];
      }

      hh = f / (h + h);
      for (j = 0; j < i; j++) {
        e[j] -= hh * d[j];
      }

      for (j = 0; j < i; j++) {
        f = d[j];
        g = e[j];
        for (k = j; k <= i - 1; k++) {
          v[(j) * n + (k)] = v[(j) * n + (k)] - (f * e[k] + g * d[k]);
        }
        d[j] = v[(j) * n + (i - 1)];
        v[(j) * n + (i)] = 0;
      }
    }
    d[i] = h;
  }

  for (i = 0; i < n - 1; i++) {
    v[(i) * n + (n - 1)] = v[(i) * n + (i)];
    v[(i) * n + (i)] = 1;
    h = d[i + 1];
    if (h !== 0) {
      for (k = 0; k <= i; k++) {
        d[k] = v[(i + 1) * n + (k)] / h;
      }

      for (j = 0; j <= i; j++) {
        g = 0;
        for (k = 0; k <= i; k++) {
          g += v[(i + 1) * n + (k)] * v[(j) * n + (k)];
        }
        for (k = 0; k <= i; k++) {
          v[(j) * n + (k)] = v[(j) * n + (k)] - g * d[k];
        }
      }
    }

    for (k = 0; k <= i; k++) {
      v[(i + 1) * n + (k)] = 0;
    }
  }

  for (j = 0; j < n; j++) {
    d[j] = v[(j) * n + (n - 1)];
    v[(j) * n + (n - 1)] = 0;
  }

  v[(n - 1) * n + (n - 1)] = 1;
  e[0] = 0;
}

function tql2(n: number, e: Float64Array, d: Float64Array, v: Float64Array): void {
  let g: number, h: number, i: number, j: number, k: number, l: number, m: number, p: number, r: number, dl1: number, c: number, c2: number, c3: number, el1: number, s: number, s2: number, iter: number;

  for (i = 1; i < n; i++) {
    e[i - 1] = e[i];
  }

  e[n - 1] = 0;

  let f = 0;
  let tst1 = 0;
  const eps = Number.EPSILON;

  for (l = 0; l < n; l++) {
    tst1 = Math.max(tst1, Math.abs(d[l]) + Math.abs(e[l]));
    m = l;
    while (m < n) {
      if (Math.abs(e[m]) <= eps * tst1) {
        break;
      }
      m++;
    }

    if (m > l) {
      iter = 0;
      do {
        iter = iter + 1;

        g = d[l];
        p = (d[l + 1] - g) / (2 * e[l]);
        r = hypotenuse(p, 1);
        if (p < 0) {
          r = -r;
        }

        d[l] = e[l] / (p + r);
        d[l + 1] = e[l] * (p + r);
        dl1 = d[l + 1];
        h = g - d[l];
        for (i = l + 2; i < n; i++) {
          d[i] -= h;
        }

        f = f + h;

        p = d[m];
        c = 1;
        c2 = c;
        c3 = c;
        el1 = e[l + 1];
        s = 0;
        s2 = 0;
        for (i = m - 1; i >= l; i--) {
          c3 = c2;
          c2 = c;
          s2 = s;
          g = c * e[i];
          h = c * p;
          r = hypotenuse(p, e[i]);
          e[i + 1] = s * r;
          s = e[i] / r;
          c = p / r;
          p = c * d[i] - s * g;
          d[i + 1] = h + s * (c * g + s * d[i]);

          for (k = 0; k < n; k++) {
            h = v[(i + 1) * n + (k)];
            v[(i + 1) * n + (k)] = s * v[(i) * n + (k)] + c * h;
            v[(i) * n + (k)] = c * v[(i) * n + (k)] - s * h;
          }
        }

        p = (-s * s2 * c3 * el1 * e[l]) / dl1;
        e[l] = s * p;
        d[l] = c * p;
      } while (Math.abs(e[l]) > eps * tst1);
    }
    d[l] = d[l] + f;
    e[l] = 0;
  }

  for (i = 0; i < n - 1; i++) {
    k = i;
    p = d[i];
    for (j = i + 1; j < n; j++) {
      if (d[j] < p) {
        k = j;
        p = d[j];
      }
    }

    if (k !== i) {
      d[k] = d[i];
      d[i] = p;
      for (j = 0; j < n; j++) {
        p = v[(i) * n + (j)];
        v[(i) * n + (j)] = v[(k) * n + (j)];
        v[(k) * n + (j)] = p;
      }
    }
  }
}

