import { DEFAULT_VIEW, type LibraryView, paramsOfView, sameView, viewFromParams } from './library-url';

const read = (params: Record<string, string>) => viewFromParams((name) => params[name] ?? null);

describe('library address', () => {
  it('should keep a plain list as a plain address and read it back as the default view', () => {
    expect(paramsOfView(DEFAULT_VIEW)).toEqual({});
    expect(read({})).toEqual(DEFAULT_VIEW);
  });

  it('should write only what differs from the default and read the same view back', () => {
    const view: LibraryView = {
      search: 'wedge', kind: 'taper', status: 'released', job: 'KL-2417', owner: 'me',
      sort: { active: 'name', direction: 'asc' }, pageIndex: 2, pageSize: 10,
    };
    const params = paramsOfView(view);
    expect(params).toEqual({ q: 'wedge', kind: 'taper', status: 'released', job: 'KL-2417', owner: 'me', sort: 'name', dir: 'asc', page: '3', size: '10' });
    expect(read(params)).toEqual(view);
  });

  it('should ignore what the page does not offer, keeping that part at its default', () => {
    const view = read({ kind: 'laser', status: 'lost', owner: '-3', sort: 'password', dir: 'up', page: '0', size: '1000' });
    expect(view).toEqual(DEFAULT_VIEW);
    expect(read({ page: 'abc', owner: '12', size: '50' })).toEqual({ ...DEFAULT_VIEW, owner: '12', pageSize: 50 });
  });

  it('should cut search and job text to what their boxes take', () => {
    const view = read({ q: 'x'.repeat(300), job: 'j'.repeat(300) });
    expect([view.search.length, view.job.length]).toEqual([100, 80]);
  });

  it('should take a sort without a direction as ascending, and trim text before comparing', () => {
    expect(read({ sort: 'job' }).sort).toEqual({ active: 'job', direction: 'asc' });
    expect(sameView({ ...DEFAULT_VIEW, search: 'wedge ' }, { ...DEFAULT_VIEW, search: 'wedge' })).toBe(true);
    expect(sameView({ ...DEFAULT_VIEW, kind: 'taper' }, DEFAULT_VIEW)).toBe(false);
  });
});
