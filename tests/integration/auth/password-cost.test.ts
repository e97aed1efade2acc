// One bcrypt cost (issue 19, Low): the demo seed's hashes and the stand-in compared for accounts
// that do not exist have the cost of members' own hashes, so that sign-in timing does not tell
// seeded accounts apart. The cost is read from the hash itself ($2b$<cost>$…, the bcrypt format).
import bcrypt from 'bcryptjs';
import { afterAll, describe, expect, it } from 'vitest';
import { eq, inArray } from 'drizzle-orm';
import { closeDb, getDb } from '@/db/client';
import { users } from '@/db/schema';
import { DEMO_PASSWORD, DEMO_USERS, seedDemo } from '@/db/seed/demo';
import { BCRYPT_COST, hashPassword, unusedPasswordHash } from '@/lib/auth/password';

afterAll(() => closeDb());

describe('bcrypt cost', () => {
  it('members, the seed and the stand-in for unknown accounts all hash with one cost', async () => {
    await seedDemo(getDb());
    const rows = await getDb().select({ hash: users.passwordHash }).from(users).where(inArray(users.email, DEMO_USERS.map((u) => u.email)));
    expect(rows).toHaveLength(DEMO_USERS.length);
    for (const row of rows) expect(bcrypt.getRounds(row.hash!)).toBe(BCRYPT_COST);
    expect(bcrypt.getRounds(await unusedPasswordHash())).toBe(BCRYPT_COST);
    expect(bcrypt.getRounds(await hashPassword('a long enough passphrase'))).toBe(BCRYPT_COST);
  });

  it('a demo account seeded earlier with cost 10 is brought to the one cost by the next seed run, keeping its password', async () => {
    await seedDemo(getDb());
    const email = DEMO_USERS[3].email;
    await getDb().update(users).set({ passwordHash: await bcrypt.hash(DEMO_PASSWORD, 10) }).where(eq(users.email, email));
    await seedDemo(getDb());
    const [row] = await getDb().select({ hash: users.passwordHash }).from(users).where(eq(users.email, email));
    expect(bcrypt.getRounds(row.hash!)).toBe(BCRYPT_COST);
    expect(await bcrypt.compare(DEMO_PASSWORD, row.hash!)).toBe(true);
  });
});
