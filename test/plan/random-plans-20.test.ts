// Random campaigns 20 to 29 (test/plan/random-plans.ts).
import { describeRandomPlans } from './random-plans.js';

describeRandomPlans(20);
