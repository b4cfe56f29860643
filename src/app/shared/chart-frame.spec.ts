import { CHART_FONT_SIZE, drawChartFrame } from './chart-frame';

function svgElement(): SVGSVGElement {
  return document.createElementNS('http://www.w3.org/2000/svg', 'svg');
}

const spec = {
  width: 500,
  height: 300,
  margin: { top: 10, right: 20, bottom: 40, left: 50 },
  x: { domain: [0, 97] as [number, number], ticks: 5, title: 'Flow (gpm)' },
  y: { domain: [0, 33] as [number, number], ticks: 4, title: 'Head (ft)' },
};

describe('drawChartFrame', () => {
  it('maps the domains, widened to round ticks, onto the plot inside the margins', () => {
    const { x, y, plot } = drawChartFrame(svgElement(), spec);
    expect(plot).toEqual({ left: 50, right: 480, top: 10, bottom: 260 });
    expect(x.domain()).toEqual([0, 100]);
    expect(y.domain()).toEqual([0, 35]);
    expect([x(0), x(100)]).toEqual([50, 480]);
    expect([y(0), y(35)]).toEqual([260, 10]);
  });

  it('sets the size and the one font on the drawing, which the axes inherit', () => {
    const element = svgElement();
    drawChartFrame(element, spec);
    expect(element.getAttribute('viewBox')).toBe('0 0 500 300');
    expect(element.getAttribute('font-size')).toBe(String(CHART_FONT_SIZE));
    const axes = [...element.querySelectorAll('g')].filter((group) => group.querySelector('.tick'));
    expect(axes.length).toBe(2);
    for (const axis of axes) expect(axis.getAttribute('font-size')).toBeNull();
    const titles = [...element.querySelectorAll('text.rf-axis-title')].map((title) => title.textContent);
    expect(titles).toEqual(['Flow (gpm)', 'Head (ft)']);
  });

  it('draws a grid line at every tick of both axes, and no title where none is given', () => {
    const element = svgElement();
    const { x, y } = drawChartFrame(element, {
      ...spec,
      x: { ...spec.x, title: undefined },
      y: { ...spec.y, title: undefined },
    });
    expect(element.querySelectorAll('.rf-grid line').length).toBe(x.ticks(5).length + y.ticks(4).length);
    expect(element.querySelectorAll('text.rf-axis-title').length).toBe(0);
  });

  it('starts afresh on each draw', () => {
    const element = svgElement();
    drawChartFrame(element, spec);
    const count = element.querySelectorAll('*').length;
    drawChartFrame(element, spec);
    expect(element.querySelectorAll('*').length).toBe(count);
  });
});
