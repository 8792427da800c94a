import jwt from 'jsonwebtoken';
import type { Config } from '../config';
import type { Role } from '../../shared/roles';

export interface TokenClaims {
  sub: string;
  role: Role;
  tv: number;
}

export function signToken(config: Config, claims: TokenClaims): { token: string; expiresAt: Date } {
  const token = jwt.sign(claims, config.jwtSecret, { algorithm: 'HS256', expiresIn: config.jwtTtlSeconds });
  return { token, expiresAt: new Date(Date.now() + config.jwtTtlSeconds * 1000) };
}

/** Returns the claims of a valid token, or undefined for a forged, expired or unsigned one. */
export function verifyToken(config: Config, token: string): TokenClaims | undefined {
  try {
    // Pinning the algorithm refuses alg "none" and key-confusion tokens.
    const payload = jwt.verify(token, config.jwtSecret, { algorithms: ['HS256'] });
    if (typeof payload !== 'object' || typeof payload.sub !== 'string' || typeof payload.tv !== 'number') return undefined;
    return { sub: payload.sub, role: payload.role as Role, tv: payload.tv };
  } catch {
    return undefined;
  }
}
