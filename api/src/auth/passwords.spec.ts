import { hashPassword, normaliseEmail, verifyPassword } from './passwords';

describe('passwords', () => {
  it('hashes with argon2id at m=19456 KiB, t=2 and verifies', async () => {
    const h = await hashPassword('correct horse battery');
    // PHC string format: $argon2id$v=19$m=19456,t=2,p=1$salt$hash
    expect(h).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
    expect(await verifyPassword(h, 'correct horse battery')).toBe(true);
    expect(await verifyPassword(h, 'wrong')).toBe(false);
    expect(await verifyPassword('not a hash', 'x')).toBe(false);
  });
  it('normalises e-mail addresses', () => {
    expect(normaliseEmail('  June@Wrenfield.Example ')).toBe('june@wrenfield.example');
  });
});
