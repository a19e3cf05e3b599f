import { checkRequestOrigin } from './origin-check';

const ours = ['http://127.0.0.1:3000'];

describe('checkRequestOrigin', () => {
  it('lets reads through whatever their origin', () => {
    expect(checkRequestOrigin('GET', { origin: 'https://evil.example' }, ours).ok).toBe(true);
  });
  it('accepts our own pages by fetch metadata or origin', () => {
    expect(checkRequestOrigin('POST', { 'sec-fetch-site': 'same-origin' }, ours).ok).toBe(true);
    expect(checkRequestOrigin('POST', { origin: 'http://127.0.0.1:3000' }, ours).ok).toBe(true);
  });
  it('refuses cross-site, same-site and origin-less writes', () => {
    expect(checkRequestOrigin('POST', { 'sec-fetch-site': 'cross-site', origin: ours[0] }, ours).ok).toBe(false);
    expect(checkRequestOrigin('DELETE', { 'sec-fetch-site': 'same-site' }, ours).ok).toBe(false);
    expect(checkRequestOrigin('PATCH', { origin: 'https://evil.example' }, ours).ok).toBe(false);
    expect(checkRequestOrigin('POST', {}, ours).ok).toBe(false);
  });
});
