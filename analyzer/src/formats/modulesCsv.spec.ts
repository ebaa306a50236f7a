import { mapSnapshot, moduleRecord } from '../carve/fixtures/moduleMapSnapshot';
import type { ClusterRecord } from '../model';
import { clustersCsv } from './clustersCsv';
import { modulesCsv } from './modulesCsv';

const text = (chunks: Iterable<string>) => [...chunks].join('');

describe('modulesCsv', () => {
  const snapshot = mapSnapshot([], {
    modules: [
      moduleRecord('file', 'src/a,b.ts', { functions: 2, cyclomatic: 5, decisions: 3, instability: 0.5, cluster: 'c1', gravity: 12.5, gravityRank: 2, reasons: ['ΣV 5', 'called from "everywhere"'] }),
      moduleRecord('file', '=cmd.ts', { abstractness: 1 }),
      moduleRecord('folder', 'src'),
    ],
  });

  it('should write a header and one row per module of the level, every field in model order', () => {
    const lines = text(modulesCsv(snapshot, 'file')).split('\r\n');
    expect(lines[0]).toBe(
      'id,path,level,name,functions,cyclomatic,decisions,nodes,edges,maxCyclomatic,overLimit,lines,fanIn,fanOut,ca,ce,instability,abstractness,designComplexity,integrationComplexity,unresolvedCalls,externalCalls,cluster,gravity,gravityRank,reasons',
    );
    // RFC 4180 §2.6–2.7: a field with a comma or a quote is quoted, quotes doubled; nulls are empty.
    expect(lines[1]).toBe('"file:src/a,b.ts","src/a,b.ts",file,,2,5,3,0,0,0,0,0,0,0,0,0,0.5,,0,0,0,0,c1,12.5,2,"ΣV 5; called from ""everywhere"""');
    // OWASP CSV injection (common practice): a cell starting with = is prefixed with a quote.
    expect(lines[2].split(',')[1]).toBe("'=cmd.ts");
    expect(lines).toHaveLength(4); // header, two files, the empty string after the last CRLF
  });

  it('should give the header alone for a level without modules or a snapshot without a map', () => {
    expect(text(modulesCsv(snapshot, 'package')).split('\r\n')).toHaveLength(2);
    expect(text(modulesCsv(mapSnapshot([], {}), 'file'))).toBe(text(modulesCsv(snapshot, 'package')));
  });
});

describe('clustersCsv', () => {
  const cluster = (id: string, level: ClusterRecord['level'], members: string[]): ClusterRecord => ({ id, level, members, functions: 7, cyclomatic: 20, decisions: 13, internalWeight: 9, externalWeight: 2.5 });

  it('should write one row per cluster of the level with its members joined', () => {
    const snapshot = mapSnapshot([], { clusters: [cluster('c1', 'file', ['file:a.ts', 'file:-b.ts']), cluster('c2', 'folder', ['folder:src'])] });
    expect(text(clustersCsv(snapshot, 'file'))).toBe(
      'id,level,modules,functions,cyclomatic,decisions,internalWeight,externalWeight,members\r\nc1,file,2,7,20,13,9,2.5,file:a.ts; file:-b.ts\r\n',
    );
    expect(text(clustersCsv(mapSnapshot([], {}), 'file'))).toBe('id,level,modules,functions,cyclomatic,decisions,internalWeight,externalWeight,members\r\n');
  });
});
