// discrete fourier transform of any length: radix-2 cooley–tukey for powers of two, and bluestein's chirp-z
// algorithm (L. Bluestein, "A linear filtering approach to the computation of the discrete Fourier transform",
// IEEE Trans. Audio Electroacoust. 18, 1970) for other lengths, through a power-of-two convolution.
// forward transform: X_k = Σ_n x_n e^{−2πi kn/N}, in place on separate real and imaginary arrays.

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
  for (let len = 2; len <= n; len <<= 1) {
    const half = len >> 1;
    const step = (sign * 2 * Math.PI) / len;
    for (let k = 0; k < half; k++) {
      // twiddles computed directly (not by recurrence) so round-off does not grow with n
      const wr = Math.cos(step * k);
      const wi = Math.sin(step * k);
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

/** forward dft of a complex sequence of any length, in place */
export function dft(re: Float64Array, im: Float64Array): void {
  const n = re.length;
  if (n <= 1) return;
  if ((n & (n - 1)) === 0) {
    radix2(re, im, -1);
    return;
  }
  // bluestein: X_k = conj(w_k) Σ_n (x_n conj(w_n)) w_{k−n}, w_m = e^{iπ m²/N}
  let m = 1;
  while (m < 2 * n - 1) m <<= 1;
  const wr = new Float64Array(n);
  const wi = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    const q = (k * k) % (2 * n); // k² mod 2N keeps the angle small and exact
    wr[k] = Math.cos((Math.PI * q) / n);
    wi[k] = Math.sin((Math.PI * q) / n);
  }
  const ar = new Float64Array(m);
  const ai = new Float64Array(m);
  for (let k = 0; k < n; k++) {
    // x·conj(w)
    ar[k] = re[k] * wr[k] + im[k] * wi[k];
    ai[k] = im[k] * wr[k] - re[k] * wi[k];
  }
  const br = new Float64Array(m);
  const bi = new Float64Array(m);
  br[0] = wr[0];
  bi[0] = wi[0];
  for (let k = 1; k < n; k++) {
    br[k] = br[m - k] = wr[k];
    bi[k] = bi[m - k] = wi[k];
  }
  radix2(ar, ai, -1);
  radix2(br, bi, -1);
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
