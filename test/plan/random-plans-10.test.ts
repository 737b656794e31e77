// Random campaigns 10 to 19 (test/plan/random-plans.ts).
import { describeRandomPlans } from './random-plans.js';

describeRandomPlans(10);
