import fs from 'node:fs';
import path from 'node:path';
import { render } from '@testing-library/react';
import { Mark } from '@/components/nav/mark';

const GEOMETRY = ['d', 'x', 'y', 'width', 'height', 'rx', 'cx', 'cy', 'r', 'stroke-width'];

/** Each drawn shape as "tag attr=value …", geometry only, in drawing order. */
function shapes(root: ParentNode) {
  return Array.from(root.querySelectorAll('rect, path, circle')).map((el) =>
    [el.tagName.toLowerCase(), ...GEOMETRY.filter((a) => el.hasAttribute(a)).map((a) => `${a}=${Number(el.getAttribute(a)) || el.getAttribute(a)}`)].join(' '),
  );
}

describe('Mark', () => {
  it('draws the same shapes as assets/mark.svg, the source of the favicon and icon', () => {
    const source = fs.readFileSync(path.join(__dirname, '../../assets/mark.svg'), 'utf8');
    const doc = new DOMParser().parseFromString(source, 'image/svg+xml');
    const { container } = render(<Mark size={40} />);
    const expected = shapes(doc);
    expect(expected.length).toBe(6);
    expect(shapes(container)).toEqual(expected);
  });
});
