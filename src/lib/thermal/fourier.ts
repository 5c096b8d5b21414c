// discrete fourier transform of any length: radix-2 cooley–tukey for powers of two, and bluestein's chirp-z
// algorithm (L. Bluestein, "A linear filtering approach to the computation of the discrete Fourier transform",
// IEEE Trans. Audio Electroacoust. 18, 1970) for other lengths, through a power-of-two convolution.
// forward transform: X_k = Σ_n x_n e^{−2πi kn/N}, in place on separate real and imaginary arrays.

// twiddle tables and bluestein chirps by length, computed once: a workbench or a sensitivity study transforms the
// same length again and again (a small bounded memo; nothing else is kept between calls)
const twiddles = new Map<number, { re: Float64Array; im: Float64Array }>();
const chirps = new Map<number, { m: number; wr: Float64Array; wi: Float64Array; br: Float64Array; bi: Float64Array }>();
const MEMO_LIMIT = 16;

function remember<T>(map: Map<number, T>, key: number, value: T): T {
  if (map.size >= MEMO_LIMIT) map.delete(map.keys().next().value as number);
  map.set(key, value);
  return value;
}

/** e^{−2πik/n} for k < n/2 */
function twiddle(n: number): { re: Float64Array; im: Float64Array } {
  const hit = twiddles.get(n);
  if (hit) return hit;
  const re = new Float64Array(n / 2);
  const im = new Float64Array(n / 2);
  for (let k = 0; k < n / 2; k++) {
    re[k] = Math.cos((2 * Math.PI * k) / n);
    im[k] = -Math.sin((2 * Math.PI * k) / n);
  }
  return remember(twiddles, n, { re, im });
}

/** in-place iterative radix-2 fft; n = re.length must be a power of two; sign −1 forward, +1 inverse (unscaled) */
function radix2(re: Float64Array, im: Float64Array, sign: number): void {
  const n = re.length;
  for (let i = 1, j = 0; i < n; i++) {
    let bit = n >> 1;
    for (; j & bit; bit >>= 1) j ^= bit;
    j ^= bit;
    if (i < j) {
      let t = re[i];
      re[i] = re[j];
      re[j] = t;
      t = im[i];
      im[i] = im[j];
      im[j] = t;
    }
  }
  const table = twiddle(n); // entries computed directly, not by recurrence, so round-off does not grow with n
  for (let len = 2; len <= n; len <<= 1) {
    const half = len >> 1;
    const stride = n / len;
    for (let k = 0; k < half; k++) {
      const wr = table.re[k * stride];
      const wi = sign * -table.im[k * stride];
      for (let i = k; i < n; i += len) {
        const j = i + half;
        const xr = re[j] * wr - im[j] * wi;
        const xi = re[j] * wi + im[j] * wr;
        re[j] = re[i] - xr;
        im[j] = im[i] - xi;
        re[i] += xr;
        im[i] += xi;
      }
    }
  }
}

/** the chirp w_k = e^{iπk²/N} and the transform of its power-of-two extension, for bluestein */
function chirp(n: number): { m: number; wr: Float64Array; wi: Float64Array; br: Float64Array; bi: Float64Array } {
  const hit = chirps.get(n);
  if (hit) return hit;
  let m = 1;
  while (m < 2 * n - 1) m <<= 1;
  const wr = new Float64Array(n);
  const wi = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    const q = (k * k) % (2 * n); // k² mod 2N keeps the angle small and exact
    wr[k] = Math.cos((Math.PI * q) / n);
    wi[k] = Math.sin((Math.PI * q) / n);
  }
  const br = new Float64Array(m);
  const bi = new Float64Array(m);
  br[0] = wr[0];
  bi[0] = wi[0];
  for (let k = 1; k < n; k++) {
    br[k] = br[m - k] = wr[k];
    bi[k] = bi[m - k] = wi[k];
  }
  radix2(br, bi, -1);
  return remember(chirps, n, { m, wr, wi, br, bi });
}

/** forward dft of a complex sequence of any length, in place */
export function dft(re: Float64Array, im: Float64Array): void {
  const n = re.length;
  if (n <= 1) return;
  if ((n & (n - 1)) === 0) {
    radix2(re, im, -1);
    return;
  }
  // bluestein: X_k = conj(w_k) Σ_n (x_n conj(w_n)) w_{k−n}, w_m = e^{iπ m²/N}
  const { m, wr, wi, br, bi } = chirp(n);
  const ar = new Float64Array(m);
  const ai = new Float64Array(m);
  for (let k = 0; k < n; k++) {
    // x·conj(w)
    ar[k] = re[k] * wr[k] + im[k] * wi[k];
    ai[k] = im[k] * wr[k] - re[k] * wi[k];
  }
  radix2(ar, ai, -1);
  for (let k = 0; k < m; k++) {
    const r = ar[k] * br[k] - ai[k] * bi[k];
    ai[k] = ar[k] * bi[k] + ai[k] * br[k];
    ar[k] = r;
  }
  radix2(ar, ai, 1);
  for (let k = 0; k < n; k++) {
    const r = ar[k] / m;
    const i = ai[k] / m;
    re[k] = r * wr[k] + i * wi[k];
    im[k] = i * wr[k] - r * wi[k];
  }
}
