import { CreateFoundation1764630000000 } from './1764630000000-CreateFoundation';
import { AnalysisData1764720000000 } from './1764720000000-AnalysisData';

/** Every migration, oldest first. Listed explicitly so compiled and test runs see the same set. */
export const MIGRATIONS = [CreateFoundation1764630000000, AnalysisData1764720000000];
