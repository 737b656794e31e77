// Random campaigns 40 to 49 (test/plan/random-plans.ts).
import { describeRandomPlans } from './random-plans.js';

describeRandomPlans(40);
