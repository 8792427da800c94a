import type { CapturedMailDto } from '../../shared/dev-mail';
import type { Config } from '../config';
import { AppError } from '../errors';

const standinDown = () =>
  new AppError('unavailable', 'The local mail stand-in is not answering. npm start and npm test start it (scripts/standins.sh).');

async function askStandin(config: Pick<Config, 'mailCaptureUrl'>, method: 'GET' | 'DELETE'): Promise<unknown> {
  let res: Response;
  try {
    res = await fetch(`${config.mailCaptureUrl}/messages`, { method, signal: AbortSignal.timeout(3000) });
  } catch {
    throw standinDown();
  }
  if (!res.ok) throw standinDown();
  return res.json();
}

const text = (v: unknown) => (typeof v === 'string' ? v : '');

/** The mail the stand-in captured, newest first. */
export async function listCapturedMail(config: Pick<Config, 'mailCaptureUrl'>): Promise<CapturedMailDto[]> {
  const data = await askStandin(config, 'GET');
  if (!Array.isArray(data)) throw standinDown();
  return data
    .map((m: Record<string, unknown>) => ({ to: text(m.to), subject: text(m.subject), text: text(m.text), html: text(m.html), date: text(m.date) }))
    .reverse();
}

export async function clearCapturedMail(config: Pick<Config, 'mailCaptureUrl'>): Promise<void> {
  await askStandin(config, 'DELETE');
}
