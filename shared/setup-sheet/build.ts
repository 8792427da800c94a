import type { LuggageStation, SpringEnd } from '../catalogue/constants';
import { quantityWords, saleUnits, unitsToBuy } from '../catalogue/sale-unit';
import { formatMoney } from '../money-format';
import { formatInches, formatLength } from '../length-format';
import { nmToFtLbf, rateInUnits } from '../units';
import type { SetupSheetDto, SetupSheetEndDto, SheetRowDto, SheetTorqueDto } from './setup-sheet.dto';

/** One end's figures as the engine gave them (now, or when the order was placed): the sheet's own fields, the rate in N/mm. */
export type EndFigures = Pick<
  SetupSheetEndDto,
  | 'end'
  | 'productId'
  | 'sku'
  | 'name'
  | 'springCount'
  | 'freeLengthMm'
  | 'preloadMm'
  | 'adjusterTurns'
  | 'spacerLengthMm'
  | 'installedLengthMm'
  | 'staticSagMm'
  | 'riderSagMm'
  | 'toleranceMm'
  | 'targets'
  | 'unitPriceCents'
  | 'currency'
  | 'adapters'
> & { rateNPerMm: number };

export type SheetInput = Pick<SetupSheetDto, 'source' | 'orderNumber' | 'bikeLabel' | 'ridingStyle'> & {
  loads: { station: string; massKg: number }[];
  ends: EndFigures[];
  /** The bike's torques, tools and notes; absent when the bike has left the catalogue. */
  bike: { torques: Pick<SheetTorqueDto, 'fastener' | 'torqueNm'>[]; tools: string[]; notes: string } | null;
};

const formats = new Map<number, Intl.NumberFormat>();
/** en-GB, at most `d` decimals: the one way the sheet writes a number, on the page and in the PDF. */
export function sheetNumber(v: number, d: number): string {
  let f = formats.get(d);
  if (!f) formats.set(d, (f = new Intl.NumberFormat('en-GB', { maximumFractionDigits: d })));
  return f.format(v);
}
// Sheets print lengths mm first with inches beside them; an lb rider's page reads inches first (shared/length-format).
const mm = (v: number, d = 1) => formatLength(v, 'both', { mmDecimals: d, gap: ' ' });
const inFirst = (v: number, d = 1) => formatLength(v, 'imperial', { mmDecimals: d, gap: ' ' });
const inOnly = (v: number) => formatInches(v, { gap: ' ' });
const kg = (v: number) => `${sheetNumber(v, 1)} kg`;

/** "45 N·m (33.2 ft·lbf)", ft·lbf through mathjs. */
export function torqueText(nm: number): string {
  return `${sheetNumber(nm, 1)} N·m (${sheetNumber(nmToFtLbf(nm), 1)} ft·lbf)`;
}

/** "6.5 N/mm · 0.66 kgf/mm · 37 lbf/in", per spring. */
export function rateText(nPerMm: number): string {
  const r = rateInUnits(nPerMm);
  return `${sheetNumber(r.nPerMm, 2)} N/mm · ${sheetNumber(r.kgfPerMm, 2)} kgf/mm · ${sheetNumber(r.lbfPerIn, 0)} lbf/in`;
}

const stationWords: Record<string, string> = { rider: 'Rider and gear', passenger: 'Passenger', 'tank-bag': 'Tank bag', panniers: 'Panniers', 'top-case': 'Top case' } satisfies Partial<Record<LuggageStation | 'rider' | 'passenger', string>>;

// Our own wording of what every spring change carries; the maker's manual and a technician come first.
export const sheetCautions = [
  'The maker\'s manual for your bike and a qualified technician come first; where they differ from this sheet, follow them.',
  'Secure the bike upright on a stand or lift, and strap it, before you unload the suspension: it moves when a spring comes out.',
  'Spring compressors and preloaded springs store energy. Use a compressor made for the job, compress evenly, keep your face and hands out of the spring\'s line, and wear eye protection.',
  'Torque every fastener to the maker\'s figures; the figures below are a guide to check against them.',
];

function fittingSteps(ends: SpringEnd[]): string[] {
  const steps = ['Support the bike so the end you work on hangs free and cannot drop, and note the present adjuster settings.'];
  if (ends.includes('fork')) {
    steps.push(
      'Fork: back the preload right off, then open one leg at a time; the cap is under spring load, so hold it as the last thread lets go.',
      'Fork: take out the old spring and spacer, fit the new spring and set its preload as shown, and refit the cap.',
    );
  }
  if (ends.includes('shock')) {
    steps.push(
      'Shock: take the shock off the bike, compress the spring with a proper compressor, swap the spring (and any seat adapter listed), and release the compressor evenly.',
      'Shock: set the preload as shown and refit the shock.',
    );
  }
  steps.push('Torque each fastener to the maker\'s figure, lower the bike, bounce the suspension a few times, then measure the sag.');
  return steps;
}

function disturbedSteps(ends: SpringEnd[]): string[] {
  const out: string[] = [];
  if (ends.includes('fork')) {
    out.push(
      'A new fork spring changes the oil level (or air gap): reset it to the maker\'s figure before the caps go back on.',
      'Both legs the same: the same spring, the same spacer length, the same oil level.',
    );
  }
  if (ends.includes('shock')) out.push('Check the shock\'s mounting bolts, bump stop and any linkage you disturbed, and that nothing rubs the spring.');
  out.push('Check the brakes, hoses and wiring routed past the suspension before the first ride.');
  return out;
}

function endRows(e: EndFigures, units: number): SheetRowDto[] {
  const rows: SheetRowDto[] = [
    { key: 'springs', label: 'Springs', value: `${quantityWords(e.end, units)}: ${e.name} (${e.sku})` },
    { key: 'rate', label: 'Rate, per spring', value: rateText(e.rateNPerMm) },
  ];
  if (e.freeLengthMm !== null) rows.push({ key: 'free-length', label: 'Free length', value: mm(e.freeLengthMm, 1), imperialValue: inFirst(e.freeLengthMm, 1) });
  rows.push({ key: 'preload', label: 'Preload', value: mm(e.preloadMm, 1), imperialValue: inFirst(e.preloadMm, 1) });
  if (e.installedLengthMm !== null) rows.push({ key: 'installed-length', label: 'Installed length', value: mm(e.installedLengthMm, 1), imperialValue: inFirst(e.installedLengthMm, 1) });
  if (e.adjusterTurns !== null) rows.push({ key: 'adjuster', label: 'Adjuster', value: `${sheetNumber(e.adjusterTurns, 1)} turns from fully out` });
  else if (e.spacerLengthMm !== null) rows.push({ key: 'spacer', label: 'Preload spacer', value: `cut to ${mm(e.spacerLengthMm, 1)}`, imperialValue: `cut to ${inFirst(e.spacerLengthMm, 1)}` });
  else if (e.end === 'fork') rows.push({ key: 'spacer', label: 'Preload spacer', value: 'set the preload above with the spacer; measure it at fitting' });
  const tol = sheetNumber(e.toleranceMm, 1);
  const sag = (mmNow: number, target: number) => ({
    value: `${sheetNumber(mmNow, 1)} mm ± ${tol} mm (target ${sheetNumber(target, 1)} mm)`,
    imperialValue: `${inOnly(mmNow)} ± ${inOnly(e.toleranceMm)}, target ${inOnly(target)} (${sheetNumber(mmNow, 1)} mm ± ${tol} mm, target ${sheetNumber(target, 1)} mm)`,
  });
  rows.push(
    { key: 'static-sag', label: 'Static sag to expect', ...sag(e.staticSagMm, e.targets.staticSagMm) },
    { key: 'rider-sag', label: 'Rider sag to expect', ...sag(e.riderSagMm, e.targets.riderSagMm) },
  );
  if (e.adapters.length) rows.push({ key: 'adapters', label: 'Adapters', value: e.adapters.map((a) => `${a.quantity} × ${a.name} (${a.sku})`).join('; ') });
  if (e.unitPriceCents !== null) rows.push({ key: 'price', label: 'Price', value: `${formatMoney(e.unitPriceCents, e.currency)} ${saleUnits[e.end].perUnit}` });
  return rows;
}

/** The whole sheet from the engine's figures and the bike's data: the page and the PDF print exactly this. */
export function buildSetupSheet(input: SheetInput): SetupSheetDto {
  const order: SpringEnd[] = ['fork', 'shock'];
  const figures = [...input.ends].sort((a, b) => order.indexOf(a.end) - order.indexOf(b.end));
  const ends: SetupSheetEndDto[] = figures.map((e) => {
    const units = unitsToBuy(e.end, e.springCount);
    return {
      end: e.end,
      title: e.end === 'fork' ? 'Fork' : 'Shock',
      productId: e.productId,
      sku: e.sku,
      name: e.name,
      springCount: e.springCount,
      units,
      unitWords: quantityWords(e.end, units),
      unitPriceCents: e.unitPriceCents,
      currency: e.currency,
      rate: rateInUnits(e.rateNPerMm),
      freeLengthMm: e.freeLengthMm,
      preloadMm: e.preloadMm,
      adjusterTurns: e.adjusterTurns,
      spacerLengthMm: e.spacerLengthMm,
      installedLengthMm: e.installedLengthMm,
      staticSagMm: e.staticSagMm,
      riderSagMm: e.riderSagMm,
      toleranceMm: e.toleranceMm,
      targets: e.targets,
      adapters: e.adapters,
      rows: endRows(e, units),
    };
  });
  const torques: SheetTorqueDto[] = (input.bike?.torques ?? []).map((t) => ({ fastener: t.fastener, torqueNm: t.torqueNm, torqueFtLbf: nmToFtLbf(t.torqueNm), text: torqueText(t.torqueNm) }));
  const endNames = ends.map((e) => e.end);
  return {
    bikeLabel: input.bikeLabel,
    ridingStyle: input.ridingStyle,
    source: input.source,
    orderNumber: input.orderNumber,
    loadLines: input.loads.map((l) => `${stationWords[l.station] ?? l.station}: ${kg(l.massKg)}`),
    ends,
    torques,
    tools: input.bike?.tools ?? [],
    bikeNotes: input.bike?.notes ?? '',
    cautions: sheetCautions,
    fittingSteps: fittingSteps(endNames),
    disturbedSteps: disturbedSteps(endNames),
    afterFitting: 'Measure sag three ways: wheel off the ground, on the bike\'s own weight, and with you aboard in your gear. Enter the readings in the sag check; it says what to change.',
  };
}
