// Crest as a library: K of an invented planet, then the demo campaign planned in code.
// Run with `node examples/library.mjs` after `npm ci` (which builds dist/).
import { fileURLToPath } from 'node:url';
import { buildPlan, readCampaign, semiAmplitudeMps } from 'crest';

const kMps = semiAmplitudeMps({ starMassSun: 0.8, planetMassEarth: 10, periodDays: 20 });
console.log(`K of 10 Earth masses on a 20-day orbit around a 0.8 Msun star: ${kMps.toFixed(2)} m/s`);

const plan = buildPlan(readCampaign(fileURLToPath(new URL('./demo/campaign.yaml', import.meta.url))), { weatherTrials: 200 });
for (const t of plan.targets) {
  console.log(`${t.targetId.padEnd(9)} ${String(t.visits).padStart(3)} visits  K/sigma_K ${t.kOverSigmaK?.toFixed(1) ?? '-'}`);
}
