// The analyzer library, the one door through which the server reaches it (the API never computes metrics itself).
export * from '../../analyzer/src';
