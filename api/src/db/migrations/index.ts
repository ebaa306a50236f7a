import { CreateFoundation1764630000000 } from './1764630000000-CreateFoundation';
import { AnalysisData1764720000000 } from './1764720000000-AnalysisData';
import { FunctionBandIndex1764800000000 } from './1764800000000-FunctionBandIndex';
import { FunctionDetailJson1764810000000 } from './1764810000000-FunctionDetailJson';
import { FunctionOrderIndexes1764820000000 } from './1764820000000-FunctionOrderIndexes';
import { FunctionOverLimitIndex1764830000000 } from './1764830000000-FunctionOverLimitIndex';
import { FunctionSortIndexes1764840000000 } from './1764840000000-FunctionSortIndexes';
import { SnapshotRowsByTrigger1764850000000 } from './1764850000000-SnapshotRowsByTrigger';

/** Every migration, oldest first. Listed explicitly so compiled and test runs see the same set. */
export const MIGRATIONS = [
  CreateFoundation1764630000000, AnalysisData1764720000000, FunctionBandIndex1764800000000, FunctionDetailJson1764810000000,
  FunctionOrderIndexes1764820000000, FunctionOverLimitIndex1764830000000, FunctionSortIndexes1764840000000, SnapshotRowsByTrigger1764850000000,
];
