import { timingSafeEqual } from 'node:crypto';

/**
 * The fake provider's own user store. Like a real identity provider it knows people and
 * passwords, not Decant roles: those live in Decant's database.
 */
export interface Account {
  accountId: string;
  email: string;
  name: string;
}

export const demoPassword = 'decant-demo';

export const accounts: Account[] = [
  { accountId: 'u-admin', email: 'admin@decant.test', name: 'Dana Whitfield' },
  { accountId: 'u-coordinator', email: 'coordinator@decant.test', name: 'Priya Raman' },
  { accountId: 'u-coordinator-east', email: 'coordinator.east@decant.test', name: 'Tomas Reyes' },
  { accountId: 'u-operator', email: 'operator@decant.test', name: 'Luis Okafor' },
  { accountId: 'u-auditor', email: 'auditor@decant.test', name: 'Margit Sand' },
];

export function findAccountById(accountId: string): Account | undefined {
  return accounts.find((account) => account.accountId === accountId);
}

export function checkCredentials(email: string, password: string): Account | null {
  const account = accounts.find((candidate) => candidate.email === email.trim().toLowerCase());
  const given = Buffer.from(password);
  const expected = Buffer.from(demoPassword);
  const passwordOk = given.length === expected.length && timingSafeEqual(given, expected);
  return account && passwordOk ? account : null;
}
