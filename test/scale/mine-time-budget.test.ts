import { describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.js';
import { capture } from '../cli/helpers/capture.js';
import { boxNetwork2d, writeBoxScenario } from '../fixtures/box-network.js';

const SMALL = ['--samples', '5000', '--check-samples', '500', '--fidelity-samples', '2000', '--no-prove', '--no-report'];

describe('specula mine --time-budget', () => {
  it('prints the warning on stderr before the run, even with --quiet, and still mines', async () => {
    const { dir, scenarioPath } = writeBoxScenario(boxNetwork2d());
    const io = capture(dir);
    // a budget of a millisecond: no estimate (it includes starting the process) fits in it
    const code = await main(['mine', scenarioPath, '--out', 'run', '--quiet', '--time-budget', '0.001', ...SMALL], io);
    expect(code).toBe(0);
    expect(io.err()).toMatch(/^specula: warning: this mine job is estimated to take about \d+ s \(sampling and checking \d+ s\), over the time budget of 0 s; it runs anyway/);
    expect(io.out()).toBe('');
  });

  it('prints nothing on stderr when the budget is generous', async () => {
    const { dir, scenarioPath } = writeBoxScenario(boxNetwork2d());
    const io = capture(dir);
    expect(await main(['mine', scenarioPath, '--out', 'run', '--quiet', '--time-budget', '86400', ...SMALL], io)).toBe(0);
    expect(io.err()).toBe('');
  });

  it('rejects a budget that is not a positive number', async () => {
    const { dir, scenarioPath } = writeBoxScenario(boxNetwork2d());
    const io = capture(dir);
    expect(await main(['mine', scenarioPath, '--time-budget', '-5', ...SMALL], io)).toBe(2);
    expect(io.err()).toContain('--time-budget');
  });
});

describe('specula check and prove --time-budget', () => {
  it('check warns before it starts when the budget is too short, and still checks', async () => {
    const { dir, scenarioPath } = writeBoxScenario(boxNetwork2d());
    const io = capture(dir);
    expect(await main(['mine', scenarioPath, '--out', 'run', '--quiet', ...SMALL], io)).toBe(0);
    const checkIo = capture(dir);
    const code = await main(['check', scenarioPath, 'run/rules.json', '--out', 'checked', '--quiet', '--no-prove', '--no-report', '--check-samples', '500', '--time-budget', '0.001'], checkIo);
    expect([0, 1]).toContain(code);
    expect(checkIo.err()).toMatch(/^specula: warning: this check job is estimated to take about \d+ s .*over the time budget of 0 s; it runs anyway/);
  });

  it('prove warns before it starts when the budget is too short, and is silent with a generous one', async () => {
    const { dir, scenarioPath } = writeBoxScenario(boxNetwork2d());
    expect(await main(['mine', scenarioPath, '--out', 'run', '--quiet', ...SMALL], capture(dir))).toBe(0);
    const short = capture(dir);
    expect(await main(['prove', 'run', '--quiet', '--jobs', '1', '--time-budget', '0.001'], short)).toBe(0);
    expect(short.err()).toMatch(/^specula: warning: this prove job is estimated to take about \d+ s .*proving .*over the time budget of 0 s/);
    const generous = capture(dir);
    expect(await main(['prove', 'run', '--quiet', '--jobs', '1', '--time-budget', '86400'], generous)).toBe(0);
    expect(generous.err()).toBe('');
  });
});
