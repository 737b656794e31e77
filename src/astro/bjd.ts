// Barycentric Julian date in TDB (Eastman, Siverd & Gaudi 2010, PASP 122, 935).
import { BaryState, Body, MakeTime } from 'astronomy-engine';
import { AU_M, C_MPS, DAY_SEC } from './constants.js';
import { jdTdb } from './time-scales.js';
import { unitVectorFromRaDec } from './vectors.js';

/**
 * BJD_TDB of a UTC instant for a star at ICRS (J2000) raDeg, decDeg:
 * BJD_TDB = JD_TDB + (r_earth . n_star) / c (Eastman, Siverd & Gaudi 2010, eq. 1, Roemer term),
 * with r_earth the Earth's barycentric position from astronomy-engine (BaryState, J2000 axes).
 * Left out, as in their error budget: the observer's offset from the geocentre (at most 21 ms),
 * the Shapiro delay (at most ~20 us) and the star's parallax; so good to about 0.03 s.
 */
export function bjdTdb(date: Date, raDeg: number, decDeg: number): number {
  const earth = BaryState(Body.Earth, MakeTime(date));
  const [nx, ny, nz] = unitVectorFromRaDec(raDeg, decDeg);
  const projectionAu = earth.x * nx + earth.y * ny + earth.z * nz;
  return jdTdb(date) + (projectionAu * AU_M) / C_MPS / DAY_SEC;
}
