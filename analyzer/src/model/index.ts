// The analyzer's data model: plain types shared with api/ and web/ (imported as types).
export * from './CountingSettings';
export * from './FlowGraph';
export * from './FunctionRecord';
export * from './Snapshot';
export * from './ModuleMap';
