// Secret tokens for invitations and viewer links: long and random, handed out once, stored only as a hash.
import { createHash, randomBytes } from 'node:crypto';

export const newToken = (): string => randomBytes(32).toString('base64url');
export const hashToken = (token: string): string => createHash('sha256').update(token).digest('hex');
