// A sign-off's signature must be a plain drawing (lib/sync/operations.ts), so nothing that could
// act when shown is ever stored, whichever way a later screen shows it.
import { describe, expect, it } from 'vitest';
import { encodeStamp } from '../../../src/lib/sync/clock';
import { isPlainDrawing, operationSchema } from '../../../src/lib/sync/operations';

// What signature_pad 5's toSVG() gives (svg.outerHTML): paths for strokes, circles for dots.
const FROM_THE_PAD =
  '<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" viewBox="0 0 358 160" width="358" height="160">' +
  '<path d="M 40.500,90.250 C 44.120,88.010 51.300,80.990 58.750,77.500" stroke-width="3.105" stroke="#14202b" fill="none" stroke-linecap="round"></path>' +
  '<circle r="1.5" cx="120.5" cy="88.25" fill="#14202b"></circle>' +
  '<line x1="10" y1="10" x2="11" y2="11" stroke="#14202b" stroke-width="3" stroke-linecap="round"></line></svg>';

describe('a signature', () => {
  it('may be what the signature pad draws', () => {
    expect(isPlainDrawing(FROM_THE_PAD)).toBe(true);
    expect(isPlainDrawing('<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><path d="M1 1 L9 9"/></svg>')).toBe(true);
  });

  it.each([
    ['a script', '<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'],
    ['an event handler', '<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"><path d="M1 1"/></svg>'],
    ['an event handler after a quote', '<svg xmlns="http://www.w3.org/2000/svg"><path d="M1 1"onclick="alert(1)"/></svg>'],
    ['a link', '<svg xmlns="http://www.w3.org/2000/svg"><a href="https://elsewhere.example"><path d="M1 1"/></a></svg>'],
    ['an image to fetch', '<svg xmlns="http://www.w3.org/2000/svg"><image xlink:href="https://tracker.example/p.png"/></svg>'],
    ['foreign markup', '<svg xmlns="http://www.w3.org/2000/svg"><foreignObject><div>hi</div></foreignObject></svg>'],
    ['a style sheet', '<svg xmlns="http://www.w3.org/2000/svg"><style>path{fill:url(https://x.example/a)}</style></svg>'],
    ['a style attribute', '<svg xmlns="http://www.w3.org/2000/svg"><path style="fill:red" d="M1 1"/></svg>'],
    ['an entity declaration', '<svg xmlns="http://www.w3.org/2000/svg"><!DOCTYPE x [<!ENTITY a "aaaa">]><path d="M1 1"/></svg>'],
    ['a processing instruction', '<svg xmlns="http://www.w3.org/2000/svg"><?xml-stylesheet href="x.css"?><path d="M1 1"/></svg>'],
    ['an animation that rewrites an attribute', '<svg xmlns="http://www.w3.org/2000/svg"><set attributeName="href" to="javascript:alert(1)"/></svg>'],
  ])('may not hold %s', (_what, svg) => {
    expect(isPlainDrawing(svg)).toBe(false);
  });

  it('is checked in the sign-off operation, with a reason', () => {
    const op = (signatureSvg: string) => ({
      opId: '6d1b7f0e-3c1a-4b5e-9d2f-0a1b2c3d4e5f',
      visitId: '7e2c8a1f-4d2b-4c6f-8e3a-1b2c3d4e5f60',
      deviceId: 'phone-1',
      stamp: encodeStamp({ wallMs: 1_780_000_000_000, counter: 0, deviceId: 'phone-1' }),
      seenStamp: null,
      kind: 'sign_off',
      payload: { signOffId: '8f3d9b2a-5e3c-4d7a-9f4b-2c3d4e5f6071', odometer: 41230, odometerUnit: '[mi_i]', customerName: 'Rosa Quill', signatureSvg, declaration: 'Done.', signedAt: '2026-05-01T10:00:00.000Z' },
    });
    expect(operationSchema.safeParse(op(FROM_THE_PAD)).success).toBe(true);
    const hostile = operationSchema.safeParse(op('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'));
    expect(hostile.success).toBe(false);
    expect(JSON.stringify(hostile.error?.issues)).toMatch(/drawing of paths/);
  });
});
