// Low-precision positions for DRAWING curves and the Sun caution only. Every event time, window
// and number the dashboard states comes from the server's sky engine; these curves just fill the
// chart between them. Formulae: the Astronomical Almanac's low-precision Sun and Moon series
// (coefficients recalled from memory, about 0.01° for the Sun and 0.3° for the Moon), the
// usual mean sidereal time (common practice).
const R = Math.PI / 180;
const sin = x => Math.sin(x * R), cos = x => Math.cos(x * R);

function daysSinceJ2000(ms) {
  return ms / 86400e3 + 2440587.5 - 2451545.0;
}

function eclipticToEquatorial(lonDeg, latDeg) {
  const eps = 23.439;
  const ra = Math.atan2(sin(lonDeg) * cos(eps) - Math.tan(latDeg * R) * sin(eps), cos(lonDeg)) / R;
  const dec = Math.asin(sin(latDeg) * cos(eps) + cos(latDeg) * sin(eps) * sin(lonDeg)) / R;
  return { raDeg: (ra + 360) % 360, decDeg: dec };
}

export function sunPosition(ms) {
  const d = daysSinceJ2000(ms);
  const L = 280.460 + 0.9856474 * d, g = 357.528 + 0.9856003 * d;
  return eclipticToEquatorial(L + 1.915 * sin(g) + 0.020 * sin(2 * g), 0);
}

export function moonPosition(ms) {
  const T = daysSinceJ2000(ms) / 36525;
  const lon = 218.32 + 481267.881 * T
    + 6.29 * sin(135.0 + 477198.87 * T) - 1.27 * sin(259.3 - 413335.36 * T)
    + 0.66 * sin(235.7 + 890534.22 * T) + 0.21 * sin(269.9 + 954397.74 * T)
    - 0.19 * sin(357.5 + 35999.05 * T) - 0.11 * sin(186.5 + 966404.03 * T);
  const lat = 5.13 * sin(93.3 + 483202.02 * T) + 0.28 * sin(228.2 + 960400.89 * T)
    - 0.28 * sin(318.3 + 6003.15 * T) - 0.17 * sin(217.6 - 407332.21 * T);
  const parallaxDeg = 0.9508 + 0.0518 * cos(135.0 + 477198.87 * T) + 0.0095 * cos(259.3 - 413335.36 * T)
    + 0.0078 * cos(235.7 + 890534.22 * T) + 0.0028 * cos(269.9 + 954397.74 * T);
  return { ...eclipticToEquatorial(lon, lat), parallaxDeg };
}

/** Geometric altitude in degrees of (ra, dec) seen from (lat, lon east-positive) at epoch ms. */
export function altitudeDeg(raDeg, decDeg, latDeg, lonDeg, ms) {
  const d = daysSinceJ2000(ms);
  const lst = 280.46061837 + 360.98564736629 * d + lonDeg;
  const ha = lst - raDeg;
  return Math.asin(sin(latDeg) * sin(decDeg) + cos(latDeg) * cos(decDeg) * cos(ha)) / R;
}

export function moonAltitudeDeg(latDeg, lonDeg, ms) {
  const m = moonPosition(ms);
  const h = altitudeDeg(m.raDeg, m.decDeg, latDeg, lonDeg, ms);
  return h - m.parallaxDeg * cos(h);
}

/** Angle in degrees between two directions. */
export function separationDeg(ra1, dec1, ra2, dec2) {
  const c = sin(dec1) * sin(dec2) + cos(dec1) * cos(dec2) * cos(ra1 - ra2);
  return Math.acos(Math.min(1, Math.max(-1, c))) / R;
}
