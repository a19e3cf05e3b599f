import { plainWords } from './http-error.filter';

describe('errors in plain words', () => {
  it('rewrites the framework and upload-library wording', () => {
    expect(plainWords({ statusCode: 404, message: 'Validation failed (numeric string is expected)' }, '/api/guilds/abc').message).toBe(
      'There is nothing at that address. Check the link.',
    );
    const big = plainWords({ statusCode: 413, message: 'File too large' }, '/api/guilds/1/shows/2/entries/3/photo');
    expect(big).toEqual({ statusCode: 413, message: 'That file is larger than 20 MB. Choose a smaller one (a phone photo is usually 2 to 8 MB).' });
    expect(plainWords({ statusCode: 413, message: 'File too large' }, '/api/guilds/1/roster-import/preview').message).toContain('5 MB');
    expect(plainWords({ statusCode: 400, message: 'Unexpected field' }, '/x').message).toBe('Send the file in the form’s own file field.');
    expect(plainWords({ statusCode: 400, message: 'Multipart: Unexpected end of form' }, '/x').message).toMatch(/cut off/);
  });

  it('leaves our own messages alone', () => {
    const ours = { statusCode: 409, message: 'Voting has opened.', errors: { a: ['b'] } };
    expect(plainWords(ours, '/x')).toBe(ours);
  });
});
