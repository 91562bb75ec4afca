// Register CSV parsing (BRIEF §3): valid files, missing columns, bad values by line, duplicates.
import { describe, expect, it } from 'vitest';
import { parseRegisterCsv } from '@/lib/import/register-csv';

const problems = (csv: string) => parseRegisterCsv(csv).problems.map((p) => [p.code, p.line, p.column ?? null]);

describe('register CSV', () => {
  it('reads every column of a full file', () => {
    const r = parseRegisterCsv(
      'tag,area,location,trap_type,application,size_dn,orifice_mm,pressure_barg,discharges_to,criticality,status\r\n' +
      'SM-TRC-112,Line Tracing,"jetty line, bay 3",thermostatic_bimetallic,tracer,15,3.2,4.5,atmosphere,low,in_service\r\n',
    );
    expect(r.problems).toEqual([]);
    expect(r.rows).toEqual([{
      line: 2, area: 'Line Tracing',
      trap: {
        tag: 'SM-TRC-112', areaId: null, location: 'jetty line, bay 3', trapType: 'thermostatic_bimetallic', application: 'tracer',
        sizeDn: 15, orificeMm: 3.2, pressureBarg: 4.5, dischargesTo: 'atmosphere', criticality: 'low', status: 'in_service',
      },
    }]);
    expect(r.hasArea).toBe(true);
  });

  it('needs only tag, trap_type and pressure_barg, in any order and case, with a BOM', () => {
    const r = parseRegisterCsv('\uFEFFPressure_Barg,TAG,Trap_Type\n8,FV-EVP-031,inverted_bucket\n');
    expect(r.problems).toEqual([]);
    expect(r.rows[0].trap).toMatchObject({ tag: 'FV-EVP-031', pressureBarg: 8, trapType: 'inverted_bucket' });
    expect(r.fields.sort()).toEqual(['pressureBarg', 'tag', 'trapType']);
    expect(r.hasArea).toBe(false);
  });

  it('names each missing required column', () => {
    expect(problems('tag,area\nA,B\n')).toEqual([['missing_column', 1, 'trap_type'], ['missing_column', 1, 'pressure_barg']]);
  });

  it('reports an empty file and a header-only file plainly', () => {
    expect(problems('')).toEqual([['empty_file', 1, null]]);
    const headerOnly = parseRegisterCsv('tag,trap_type,pressure_barg\n');
    expect(headerOnly.rows).toEqual([]);
    expect(headerOnly.problems).toEqual([]);
  });

  it('warns about unknown columns and refuses a doubled one', () => {
    expect(problems('tag,trap_type,pressure_barg,colour,tag\nA,float_thermostatic,3,red,A\n'))
      .toEqual([['unknown_column', 1, 'colour'], ['duplicate_column', 1, 'tag']]);
  });

  it('reports bad values with the line where the row starts, counting quoted line breaks', () => {
    const csv = 'tag,location,trap_type,pressure_barg,size_dn\n' +
      'A-1,"two\nlines",thermodynamic_disc,8,15\n' +
      '\n' +
      'A-2,x,thermodynamic_disc,eight,15\n' +
      'A-3,x,thermodynamic_disc,8,15.5\n' +
      'A-4,x,thermodynamic_disc\n';
    expect(problems(csv)).toEqual([
      ['invalid_value', 5, 'pressure_barg'],
      ['invalid_value', 6, 'size_dn'],
      ['wrong_field_count', 7, null],
    ]);
    const r = parseRegisterCsv(csv);
    expect(r.rows.map((x) => [x.line, x.trap.tag])).toEqual([[2, 'A-1']]);
    expect(r.problems[0].message).toContain('"eight"');
  });

  it('refuses a tag given twice (case-insensitively) and points at the first', () => {
    const r = parseRegisterCsv('tag,trap_type,pressure_barg\nfv-1,inverted_bucket,3\nFV-1,inverted_bucket,3\n');
    expect(r.problems).toMatchObject([{ code: 'duplicate_tag', line: 3, message: 'Tag FV-1 already appears on line 2.' }]);
    expect(r.rows).toHaveLength(1);
  });
});
