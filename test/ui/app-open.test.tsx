import { describe, expect, it } from 'vitest';
import type { PresetInfo } from '../../src/store/presets';
import { demoDesign, KEYS, memoryServices, renderApp, settle } from '../helpers/ui';

const PRESET: PresetInfo = { id: 'fan-control', name: 'Fan and over-temperature', description: 'A fan.', path: '/opt/tapline/presets/fan-control.tapline.json' };

/** Services with one preset whose file holds the demo design renamed. */
function withPreset() {
  const services = memoryServices({ presets: async () => [PRESET] });
  services.files.set(PRESET.path, { ...demoDesign(), name: 'Fan and over-temperature' });
  return services;
}

describe('App open', () => {
  it('opens a preset by its name as a new design that asks for a file name on save', async () => {
    const services = withPreset();
    const app = renderApp({ services });
    await settle();
    await app.press('o');
    expect(app.frame()).toContain('open file or preset');
    for (const c of 'fan-control') await app.press(c);
    await app.press(KEYS.enter);
    await settle();
    expect(app.frame()).toContain('opened preset fan-control: Fan and over-temperature');
    await app.press('s');
    expect(app.frame()).toContain('save as fan-control.tapline.json');
    expect(services.files.has('/opt/tapline/presets/fan-control.tapline.json')).toBe(true);
    app.unmount();
  });

  it('lists the presets after the recent files with Up', async () => {
    const app = renderApp({ services: withPreset() });
    await settle();
    await app.press('o', KEYS.up);
    expect(app.frame()).toContain('open file or preset fan-control');
    app.unmount();
  });

  it('names the presets when Enter is pressed on an empty path', async () => {
    const app = renderApp({ services: withPreset() });
    await settle();
    await app.press('o', KEYS.enter);
    expect(app.frame()).toContain('or ↑/↓ to pick one of 1 preset');
    app.unmount();
  });

  it('prefers a file of the same name in the working folder over a preset', async () => {
    const services = withPreset();
    services.files.set('/work/fan-control', { ...demoDesign(), name: 'Local copy' });
    const app = renderApp({ services });
    await settle();
    await app.press('o');
    for (const c of 'fan-control') await app.press(c);
    await app.press(KEYS.enter);
    await settle();
    expect(app.frame()).toContain('opened /work/fan-control');
    app.unmount();
  });
});
