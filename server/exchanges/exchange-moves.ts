import type { EntityManager } from 'typeorm';
import { canMoveExchange, exchangeMoveRefusal, type ExchangeState } from '../../shared/exchange-status';
import { AppError } from '../errors';
import { Exchange } from './Exchange.entity';

// The milestone each state stamps when an exchange reaches it.
const milestones: Partial<Record<ExchangeState, 'decidedAt' | 'receivedAt' | 'shippedAt'>> = {
  approved: 'decidedAt',
  refused: 'decidedAt',
  received: 'receivedAt',
  shipped: 'shippedAt',
  refunded: 'receivedAt',
};

/** Loads an exchange under a row lock: every change to one starts here, so two changes (two staff, two clicks) never interleave. */
export async function lockExchange(em: EntityManager, id: string): Promise<Exchange> {
  const e = await em.getRepository(Exchange).findOne({ where: { id }, lock: { mode: 'pessimistic_write' } });
  if (!e) throw AppError.notFound('The exchange');
  return e;
}

/** The one way an exchange changes state: only as canMoveExchange allows, with its milestone stamped; a refused move is a 409 naming it. */
export async function moveExchange(em: EntityManager, e: Exchange, to: ExchangeState, at = new Date()): Promise<Exchange> {
  const refusal = exchangeMoveRefusal(e, to);
  if (refusal || !canMoveExchange(e, to)) throw new AppError('conflict', `${e.number}: ${refusal}`, undefined, { from: e.state, to });
  e.state = to;
  const stamp = milestones[to];
  if (stamp && !e[stamp]) e[stamp] = at;
  return em.getRepository(Exchange).save(e);
}
