import path from 'node:path';
import type { Site } from '../model.js';
import type { Instrument } from '../rv/instrument.js';
import { readInstrument } from './instrument.js';
import { INSTRUMENTS_DIR, SITES_DIR } from './paths.js';
import { listIds, resolveRef } from './resolve.js';
import { readSite } from './site.js';

/** Every bundled site file, sorted by id. */
export function readBundledSites(): Site[] {
  return listIds(SITES_DIR).map((id) => readSite(path.join(SITES_DIR, `${id}.json`)));
}

/** Every bundled instrument profile, sorted by id. */
export function readBundledInstruments(): Instrument[] {
  return listIds(INSTRUMENTS_DIR).map((id) => readInstrument(path.join(INSTRUMENTS_DIR, `${id}.json`)));
}

/** A site from a command-line `--site` value: a bundled id or a path. */
export function siteFromFlag(ref: string): Site {
  return readSite(resolveRef(ref, SITES_DIR, 'site', { file: 'command line', field: '--site', baseDir: process.cwd() }));
}

/** An instrument from a command-line `--instrument` value: a bundled id or a path. */
export function instrumentFromFlag(ref: string): Instrument {
  return readInstrument(resolveRef(ref, INSTRUMENTS_DIR, 'instrument', { file: 'command line', field: '--instrument', baseDir: process.cwd() }));
}
