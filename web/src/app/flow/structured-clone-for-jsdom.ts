import { deserialize, serialize } from 'node:v8';

// Test support only: jest's jsdom environment has no structuredClone, and dagre's ordering step
// clones plain layout data with it. Node's serializer gives the same copy for such data.
globalThis.structuredClone ??= ((value: unknown) => deserialize(serialize(value))) as typeof structuredClone;
