// @vitest-environment happy-dom
import { describe, expect, it } from 'vitest';
import type { PlotProperties } from '../../core/model/designTypes';
import { plotPopupContent } from './plotPopup';

const plot: PlotProperties = {
  plot_id: 'HEA-01',
  stratum: 'Heath',
  role: 'primary',
  rank: 1,
  lon: 150.0012345,
  lat: -34.9987654,
  utm_zone: '56S',
  easting: 317100.1,
  northing: 6125000.2,
  mgrs: '56HKH1710025000',
  nearest_exclusion_m: 42.4,
  nearest_exclusion_kind: 'cliff',
  design_density_per_ha: 0.5,
  notes: '<img src=x onerror=alert(1)>',
};

describe('the plot popup', () => {
  it('shows id, position in three systems and the nearest exclusion as text', () => {
    const node = plotPopupContent(plot, 'Coastal heath');
    const text = node.textContent ?? '';
    expect(text).toContain('HEA-01');
    expect(text).toContain('-34.998765, 150.001235');
    expect(text).toContain('56S 317100.1 E 6125000.2 N');
    expect(text).toContain('56HKH1710025000');
    expect(text).toContain('42 m (cliff)');
  });

  it('says a rejected plot is rejected, with the reason, and names what replaces it', () => {
    const rejected: PlotProperties = { ...plot, status: 'rejected', reject_reason: 'Unsafe to reach', rejected_at: '2026-12-01T09:30:00Z' };
    const node = plotPopupContent(rejected, 'Coastal heath (HEA)', { key: 'rejected', active: false, reason: 'Unsafe to reach', atIso: '2026-12-01T09:30:00Z', replacedBy: 'HEA-R1', standIn: 'HEA-R1', replaces: null });
    expect(node.dataset.state).toBe('rejected');
    expect(node.querySelector('h3')?.textContent).toBe('HEA-01 (rejected)');
    expect(node.textContent).toContain('REJECTED 2026-12-01 09:30 UTC: Unsafe to reach. Do not visit; replaced by HEA-R1.');
    expect(node.textContent).not.toContain('primary');
  });

  it('keeps markup in notes as text, never as elements', () => {
    const node = plotPopupContent(plot, '<b>bold</b>');
    expect(node.querySelector('img, b')).toBeNull();
    expect(node.textContent).toContain('<img src=x onerror=alert(1)>');
  });
});
