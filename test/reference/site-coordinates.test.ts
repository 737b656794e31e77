// The bundled sites' coordinates (recalled from memory) against a published registry: the observatory
// list of astropy-data (coordinates/sites.json; most entries from the IRAF observatory database),
// values copied here once as [latitude, east longitude (deg), elevation (m), the registry's key].
import { describe, expect, it } from 'vitest';
import { readBundledSites } from '../../src/io/site-list.js';

const REGISTRY: Record<string, [number, number, number, string]> = {
  'calar-alto': [37.22361111, -2.546111, 2168, 'CAHA'],
  'cerro-tololo': [-30.165277778, -70.815, 2215, 'ctio'],
  'haute-provence': [43.930833333, 5.713333333, 650, 'ohp'],
  'kitt-peak': [31.963333333, -111.6, 2120, 'kpno'],
  'la-silla': [-29.256666667, -70.73, 2347, 'lasilla'],
  lick: [37.343333333, -121.636666667, 1290, 'lick'],
  'mauna-kea': [19.823801447, -155.469046753, 4213, 'gemini_north'],
  mcdonald: [30.671666694, -104.021666694, 2075, 'mcdonald'],
  paranal: [-24.62743941, -70.40498688, 2669, 'paranal'],
  'roque-muchachos': [28.758333333, -17.88, 2327, 'lapalma'],
  'siding-spring': [-31.273361111, 149.061194444, 1149, 'sso'],
  sutherland: [-32.375823, 20.810808, 1798, 'salt'],
};

describe('bundled site coordinates against the astropy-data observatory registry', () => {
  const sites = readBundledSites();

  it('lists every bundled site', () => {
    expect(sites.map((s) => s.id).sort()).toEqual(Object.keys(REGISTRY).sort());
  });

  it.each(Object.keys(REGISTRY))('%s: within 0.01 deg (about 1 km) and 100 m', (id) => {
    const site = sites.find((s) => s.id === id)!;
    const [latDeg, lonDeg, elevationM] = REGISTRY[id]!;
    expect(Math.abs(site.latitudeDeg - latDeg)).toBeLessThan(0.01);
    expect(Math.abs(site.longitudeDeg - lonDeg)).toBeLessThan(0.01);
    expect(Math.abs(site.elevationM - elevationM)).toBeLessThan(100);
  });
});
