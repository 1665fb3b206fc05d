import { describe, expect, it } from 'vitest';
import { pageNames } from './write-html-reports';

describe('pageNames()', () => {
  it('pageNames() keeps letters, digits, ".", "_" and "-" in lower case and turns every other run into "-"', () => {
    expect(pageNames(['QA-107', 'coil 7/B', '<img src=x onerror=alert(1)>', '../../etc/passwd'])).toEqual([
      'qa-107.html', 'coil-7-b.html', 'img-src-x-onerror-alert-1.html', 'etc-passwd.html',
    ]);
  });

  it('pageNames() makes colliding names unique in order, keeps "index" for the index page, and names an id with nothing usable "coil"', () => {
    expect(pageNames(['QA 107', 'qa-107', 'QA-107', 'index', '***', '温度'])).toEqual([
      'qa-107.html', 'qa-107-2.html', 'qa-107-3.html', 'index-2.html', 'coil.html', 'coil-2.html',
    ]);
  });

  it('pageNames() TSDoc example', () => {
    expect(pageNames(['QA-107', 'qa 107', '<img>'])).toEqual(['qa-107.html', 'qa-107-2.html', 'img.html']);
  });

  it('pageNames() is at most 60 characters before ".html"', () => {
    expect(pageNames(['x'.repeat(200)])[0]).toBe(`${'x'.repeat(60)}.html`);
  });
});
