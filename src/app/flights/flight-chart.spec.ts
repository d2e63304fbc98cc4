import { TestBed } from '@angular/core/testing';
import { By } from '@angular/platform-browser';
import { BaseChartDirective } from 'ng2-charts';
import { FlightChart, pointAt } from './flight-chart';
import type { FlightEvent, FlightSeriesPoint } from './flight-data';

const series: FlightSeriesPoint[] = [
  { t: -1, altitudeM: 0, speedMps: 0 },
  { t: 0, altitudeM: 0, speedMps: 0 },
  { t: 2, altitudeM: 80, speedMps: 80 },
  { t: 10, altitudeM: 400, speedMps: 2 },
  { t: 11, altitudeM: 401, speedMps: -1 },
  { t: 60, altitudeM: 0, speedMps: 0 },
];
const events: FlightEvent[] = [
  { kind: 'liftoff', t: 0 },
  { kind: 'burnout', t: 2 },
  { kind: 'apogee', t: 10.5 },
  { kind: 'landing', t: 60 },
];

describe('FlightChart', () => {
  // jsdom has no canvas; Chart.js then draws nothing, which is all these checks need.
  beforeAll(() => jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null));
  beforeEach(() => jest.spyOn(console, 'error').mockImplementation(() => undefined));
  afterEach(() => (console.error as jest.Mock).mockRestore());

  const render = async () => {
    const fixture = TestBed.createComponent(FlightChart);
    fixture.componentRef.setInput('series', series);
    fixture.componentRef.setInput('events', events);
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  };

  it('should describe the chart in words for screen readers', async () => {
    const el = await render();
    const label = el.querySelector('[role=img]')!.getAttribute('aria-label')!;
    expect(label).toContain('Highest point 401 m at 11.0 s');
    expect(label).toContain('fastest climb 80 m/s at 2.0 s');
    expect(el.querySelector('canvas')).not.toBeNull();
  });

  it('should list the events in a table with altitude and speed at each', async () => {
    const el = await render();
    const rows = Array.from(el.querySelectorAll('tbody tr')).map((r) =>
      Array.from(r.children).map((c) => c.textContent!.trim()),
    );
    expect(rows).toEqual([
      ['Liftoff', '0.0', '0', '0'],
      ['Motor burnout', '2.0', '80', '80'],
      ['Apogee (highest point)', '10.5', '400.5', '0.5'],
      ['Landing', '60.0', '0', '0'],
    ]);
    expect(el.querySelector('th[scope=col]')!.textContent).toBe('Event');
  });

  it('should chart altitude and speed on their own axes and mark the events on the altitude line', async () => {
    const fixture = TestBed.createComponent(FlightChart);
    fixture.componentRef.setInput('series', series);
    fixture.componentRef.setInput('events', events);
    await fixture.whenStable();
    const chart = fixture.debugElement.query(By.directive(BaseChartDirective)).injector.get(BaseChartDirective);
    const [altitude, speed, marks] = chart.data!.datasets;
    expect(altitude.data).toHaveLength(series.length);
    expect((speed as { yAxisID?: string }).yAxisID).toBe('speed');
    expect(marks.label).toBe('Events');
    expect(marks.data).toEqual([
      { x: 0, y: 0 },
      { x: 2, y: 80 },
      { x: 10.5, y: 400.5 },
      { x: 60, y: 0 },
    ]);
  });

  it('should show no table without events', async () => {
    const fixture = TestBed.createComponent(FlightChart);
    fixture.componentRef.setInput('series', series);
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).querySelector('table')).toBeNull();
  });
});

describe('pointAt', () => {
  it('should read between the two nearest points and hold at the ends', () => {
    expect(pointAt(series, 1)).toEqual({ altitudeM: 40, speedMps: 40 });
    expect(pointAt(series, 100)).toEqual({ altitudeM: 0, speedMps: 0 });
    expect(pointAt(series, -5)).toEqual({ altitudeM: 0, speedMps: 0 });
    expect(pointAt([], 1)).toBeNull();
  });
});
