/**
 * In-process cost of each stage a rear-spring request goes through, in µs per request, for the libraries' path
 * (class-transformer + class-validator) and the compiled one: parse, refusal walk, transform, validate, engine,
 * serialise. No HTTP: this says where the time of a request goes, beside the HTTP figures.
 */
import 'reflect-metadata';
import { plainToInstance } from 'class-transformer';
import { validateSync } from 'class-validator';
import { RearSpringRequestDto } from '../shared/dto/calculations.dto';
import { computeRearSpring } from '../shared/engine';
import { validatorOptions } from '../server/http/validation/class-validator-parse';
import { compiledIsValid, compiledTransform, listsWhereObjectsBelong } from '../server/http/validation/compiled-validator';
import { hasUnreadable } from '../server/http/validate';

type Stage = [name: string, run: () => unknown];

function time(run: () => unknown, n: number): number {
  for (let i = 0; i < Math.min(n, 2000); i++) run();
  const t = process.hrtime.bigint();
  for (let i = 0; i < n; i++) run();
  return Number(process.hrtime.bigint() - t) / n / 1000;
}

export function stageTimes(body: object, n = 20_000): void {
  const text = JSON.stringify(body);
  const plain = JSON.parse(text) as Record<string, unknown>;
  const before = plainToInstance(RearSpringRequestDto, plain);
  const after = compiledTransform(RearSpringRequestDto, plain);
  const result = computeRearSpring(after);
  const shared: Stage[] = [
    ['parse (JSON.parse)', () => JSON.parse(text)],
    ['refusal walk (depth, text, object machinery)', () => hasUnreadable(plain)],
  ];
  const libraries: Stage[] = [
    ['transform (class-transformer)', () => plainToInstance(RearSpringRequestDto, plain)],
    ['validate (class-validator)', () => validateSync(before, validatorOptions)],
  ];
  const compiled: Stage[] = [
    ['lists-in-lists check', () => listsWhereObjectsBelong(RearSpringRequestDto, plain)],
    ['transform (compiled)', () => compiledTransform(RearSpringRequestDto, plain)],
    ['validate (compiled)', () => compiledIsValid(after)],
  ];
  const tail: Stage[] = [
    ['engine (computeRearSpring)', () => computeRearSpring(after)],
    ['serialise (JSON.stringify)', () => JSON.stringify(result)],
  ];
  const report = (title: string, stages: Stage[]) => {
    const rows = stages.map(([name, run]) => [name, time(run, n)] as const);
    console.log(`  ${title}: ${rows.map(([name, us]) => `${name} ${us.toFixed(1)}`).join(' | ')} | total ${rows.reduce((s, [, us]) => s + us, 0).toFixed(1)} µs`);
  };
  console.log('\nrear-spring in process, µs per request (same body as the HTTP run)');
  report('before (libraries)', [...shared, ...libraries, ...tail]);
  report('after (compiled)  ', [...shared, ...compiled, ...tail]);
}
