import { CreateFoundation1764630000000 } from './1764630000000-CreateFoundation';

/** Every migration, oldest first. Listed explicitly so compiled and test runs see the same set. */
export const MIGRATIONS = [CreateFoundation1764630000000];
