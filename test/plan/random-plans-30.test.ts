// Random campaigns 30 to 39 (test/plan/random-plans.ts).
import { describeRandomPlans } from './random-plans.js';

describeRandomPlans(30);
