// Random campaigns 0 to 9 (test/plan/random-plans.ts).
import { describeRandomPlans } from './random-plans.js';

describeRandomPlans(0);
