import { Command } from 'commander';
import { registerAmplitude } from './amplitude.js';
import { registerDetect } from './detect.js';
import { registerInstruments } from './instruments.js';
import { registerMap } from './map.js';
import { registerNext } from './next.js';
import { registerNights } from './nights.js';
import { registerPeriodogram } from './periodogram.js';
import { registerPlan } from './plan.js';
import { registerPrecision } from './precision.js';
import { registerReport } from './report.js';
import { registerSites } from './sites.js';
import { registerVisibility } from './visibility.js';

/** The `crest` program. Each command lives in its own file and registers itself here. */
export function buildProgram(): Command {
  const program = new Command('crest')
    .description('Plan radial-velocity exoplanet campaigns: visibility, detectability and phase-aware scheduling.')
    .version('0.1.0')
    .option('--debug', 'show stack traces for internal errors')
    // Commander's own messages (unknown option, missing argument) are printed by main.ts in Crest's shape.
    .configureOutput({ outputError: () => undefined })
    .exitOverride();
  const commands: ((program: Command) => Command)[] = [
    registerAmplitude,
    registerDetect,
    registerInstruments,
    registerMap,
    registerNext,
    registerNights,
    registerPeriodogram,
    registerPlan,
    registerPrecision,
    registerReport,
    registerSites,
    registerVisibility,
  ];
  for (const register of commands) register(program).exitOverride();
  return program;
}
