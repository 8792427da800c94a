import { benchCalculations } from './calculations';

const benches: Record<string, () => Promise<void>> = {
  calculations: benchCalculations,
};

const wanted = process.argv.slice(2).filter((a) => !a.startsWith('-'));
const names = wanted.length ? wanted : Object.keys(benches);
for (const name of names) {
  const bench = benches[name];
  if (!bench) {
    console.error(`unknown benchmark '${name}'; known: ${Object.keys(benches).join(', ')}`);
    process.exit(2);
  }
  console.log(`\n== ${name} ==`);
  await bench();
}
process.exit(0);
