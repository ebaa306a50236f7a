import {
  apiParamsFromQuery,
  DEFAULT_QUERY,
  hasFilter,
  paramsFromQuery,
  queryFromParams,
  sameQuery,
  startOrder,
} from './function-query';

describe('function query in the URL', () => {
  it('should open on the most complex functions first, 50 a page', () => {
    expect(queryFromParams({})).toEqual({ sort: 'cyclomatic', order: 'desc', page: 1, pageSize: 50 });
  });

  it('should read every filter, the sort and the page', () => {
    const query = queryFromParams({
      q: '  plan ',
      module: 'folder:src/orders',
      cluster: 'c3',
      band: 'busy',
      overLimit: 'false',
      sort: 'loc',
      order: 'asc',
      page: '4',
      pageSize: '100',
    });
    expect(query).toEqual({
      q: 'plan',
      module: 'folder:src/orders',
      cluster: 'c3',
      band: 'busy',
      overLimit: false,
      sort: 'loc',
      order: 'asc',
      page: 4,
      pageSize: 100,
    });
  });

  it.each([
    ['band', 'red'],
    ['sort', 'band'],
    ['order', 'up'],
    ['overLimit', 'yes'],
    ['module', 'src/orders'],
    ['page', '0'],
    ['page', '2.5'],
    ['pageSize', '501'],
    ['pageSize', '-5'],
  ])('should ignore %s=%s rather than send it to the server', (key, value) => {
    expect(queryFromParams({ [key]: value })).toEqual(DEFAULT_QUERY);
  });

  it('should take the first of repeated parameters', () => {
    expect(queryFromParams({ band: ['knotted', 'calm'] }).band).toBe('knotted');
  });

  it('should leave defaults out of the URL and keep everything else', () => {
    expect(paramsFromQuery(DEFAULT_QUERY)).toEqual({});
    const query = queryFromParams({ q: 'quote', band: 'calm', overLimit: 'true', sort: 'name', order: 'asc', page: '2' });
    const params = paramsFromQuery(query);
    expect(params).toEqual({ q: 'quote', band: 'calm', overLimit: 'true', sort: 'name', order: 'asc', page: '2' });
    expect(queryFromParams(params)).toEqual(query);
  });

  it('should write the sort when only the order differs from the default', () => {
    expect(paramsFromQuery({ ...DEFAULT_QUERY, order: 'asc' })).toEqual({ sort: 'cyclomatic', order: 'asc' });
  });

  it('should send the server every parameter as text', () => {
    expect(apiParamsFromQuery({ ...DEFAULT_QUERY, cluster: 'c1', overLimit: true })).toEqual({
      cluster: 'c1',
      overLimit: 'true',
      sort: 'cyclomatic',
      order: 'desc',
      page: '1',
      pageSize: '50',
    });
  });

  it('should tell filtered queries and equal queries apart', () => {
    expect(hasFilter(DEFAULT_QUERY)).toBe(false);
    expect(hasFilter({ ...DEFAULT_QUERY, overLimit: false })).toBe(true);
    expect(sameQuery(DEFAULT_QUERY, { ...DEFAULT_QUERY })).toBe(true);
    expect(sameQuery(DEFAULT_QUERY, { ...DEFAULT_QUERY, page: 2 })).toBe(false);
    expect(sameQuery(DEFAULT_QUERY, { ...DEFAULT_QUERY, q: 'x' })).toBe(false);
  });

  it('should start names A–Z and figures highest first', () => {
    expect(startOrder('name')).toBe('asc');
    expect(startOrder('file')).toBe('asc');
    expect(startOrder('essential')).toBe('desc');
  });
});
