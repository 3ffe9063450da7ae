/**
 * Generated request bodies for the fuzz test (fast-check): raw text and bytes, any JSON, objects
 * with the route's own keys holding hostile values, valid bodies with one field swapped, and
 * wrong content types. Each body is sent once; `seed` makes a run repeatable.
 */
import fc from 'fast-check';
import { planArb } from './random-plan';

export interface FuzzBody {
  contentType: string;
  body: string;
}

const hostileString = fc.oneof(
  fc.string({ maxLength: 40 }),
  fc.string({ unit: 'grapheme', maxLength: 40 }),
  fc.constantFrom('', ' ', '\u0000', '0x1', '%31', '1%20', '-1', '1e309', 'NaN', 'constructor', '__proto__', 'toString', '<script>alert(1)</script>', '../../etc/passwd', "' OR 1=1 --", 'a'.repeat(5000)),
  fc.emailAddress(),
);

const leafValue = fc.oneof(
  hostileString,
  fc.integer(),
  fc.double(),
  fc.boolean(),
  fc.constant(null),
  fc.constantFrom('approve', 'return', 'admin', 'reviewer', 'crew_lead', 'apprentice', 'submit', 'reopen', 'resolve', 'unresolve', 'invite', 'role', 'disable', 'enable', 'true', 'false', 1, 2, 0, 2 ** 31, -0),
);

const anyValue = fc.oneof({ maxDepth: 3 }, leafValue, fc.jsonValue({ maxDepth: 3 }), fc.array(leafValue, { maxLength: 5 }));

/** Nesting far deeper than any honest body. */
const deep = fc.integer({ min: 50, max: 3000 }).map((n) => `${'['.repeat(n)}${']'.repeat(n)}`);

/** Plausible values for the keys routes read, so that many bodies get past validation. */
const PLAUSIBLE: Record<string, fc.Arbitrary<unknown>> = {
  email: fc.oneof(fc.emailAddress(), fc.stringMatching(/^[a-z][a-z0-9.]{0,10}@[a-z]{1,8}\.test$/)),
  password: fc.string({ minLength: 1, maxLength: 40 }),
  confirm: fc.string({ maxLength: 40 }),
  token: fc.string({ minLength: 10, maxLength: 60 }),
  name: fc.string({ minLength: 1, maxLength: 60 }),
  title: fc.string({ minLength: 1, maxLength: 60 }),
  structure: fc.string({ maxLength: 60 }),
  role: fc.constantFrom('admin', 'reviewer', 'crew_lead', 'apprentice'),
  decision: fc.constantFrom('approve', 'return'),
  comment: fc.string({ maxLength: 200 }),
  teachingNote: fc.string({ maxLength: 200 }),
  body: fc.string({ maxLength: 200 }),
  elementId: fc.constantFrom('A', 'B', 'CB', 'W1', 'jA', 'nope'),
  revision: fc.integer({ min: 0, max: 5 }),
  resolved: fc.boolean(),
  disabled: fc.boolean(),
};

function keyed(keys: string[], extra: Record<string, fc.Arbitrary<unknown>> = {}) {
  const entries = keys.map((k) => {
    const own = extra[k] ?? PLAUSIBLE[k];
    return [k, own ? fc.oneof({ weight: 3, arbitrary: own }, { weight: 1, arbitrary: anyValue }) : anyValue] as const;
  });
  const model = Object.fromEntries(entries);
  // Half the time every key is there (bodies that reach the route's logic), half the time any subset.
  const record = fc.oneof(fc.record(model), fc.record(model, { requiredKeys: [] }));
  return record.chain((o) => fc.dictionary(fc.string({ maxLength: 8 }), anyValue, { maxKeys: 2 }).map((more) => ({ ...more, ...o })));
}

/** JSON bodies for an API route that knows `keys` (empty: the route reads no body). */
export function jsonBodies(keys: string[], extra: Record<string, fc.Arbitrary<unknown>> = {}): fc.Arbitrary<FuzzBody> {
  const json = (a: fc.Arbitrary<unknown>) => a.map((v) => ({ contentType: 'application/json', body: JSON.stringify(v) ?? 'null' }));
  return fc.oneof(
    { weight: 5, arbitrary: json(keyed(keys, extra)) },
    { weight: 2, arbitrary: json(fc.jsonValue({ maxDepth: 4 })) },
    { weight: 1, arbitrary: fc.string({ maxLength: 200 }).map((body) => ({ contentType: 'application/json', body })) },
    { weight: 1, arbitrary: deep.map((body) => ({ contentType: 'application/json', body })) },
    { weight: 1, arbitrary: fc.tuple(fc.constantFrom('text/plain', 'application/x-www-form-urlencoded', 'multipart/form-data; boundary=x', 'application/xml', ''), fc.string({ maxLength: 100 })).map(([contentType, body]) => ({ contentType, body })) },
  );
}

/** Form bodies (urlencoded, sometimes multipart or not a form at all) for a page that reads `keys`. */
export function formBodies(keys: string[], extra: Record<string, fc.Arbitrary<unknown>> = {}): fc.Arbitrary<FuzzBody> {
  const value = (k: string) => {
    const own = extra[k] ?? PLAUSIBLE[k];
    return own ? fc.oneof({ weight: 3, arbitrary: own }, { weight: 1, arbitrary: hostileString }) : hostileString;
  };
  const model = Object.fromEntries(keys.map((k) => [k, value(k)]));
  const fields = fc.oneof(fc.record(model), fc.record(model, { requiredKeys: [] })).chain((o) => fc.dictionary(fc.string({ maxLength: 8 }), hostileString, { maxKeys: 2 }).map((more) => ({ ...more, ...o })));
  return fc.oneof(
    { weight: 6, arbitrary: fields.map((o) => ({ contentType: 'application/x-www-form-urlencoded', body: new URLSearchParams(Object.entries(o).map(([k, v]) => [k, String(v)])).toString() })) },
    { weight: 1, arbitrary: fields.map((o) => ({ contentType: 'multipart/form-data; boundary=fz', body: `${Object.entries(o).map(([k, v]) => `--fz\r\nContent-Disposition: form-data; name="${k}"\r\n\r\n${String(v)}\r\n`).join('')}--fz--\r\n` })) },
    { weight: 1, arbitrary: fc.tuple(fc.constantFrom('application/json', 'text/plain', 'multipart/form-data', 'multipart/form-data; boundary=q', 'application/octet-stream'), fc.string({ maxLength: 200 })).map(([contentType, body]) => ({ contentType, body })) },
  );
}

/** Plan documents: valid ones from the property-test generator, and ones with a field swapped. */
export const documents: fc.Arbitrary<unknown> = fc.oneof(
  planArb,
  fc.tuple(planArb, fc.constantFrom('format', 'version', 'system', 'criteria', 'nodes', 'links', 'title'), anyValue).map(([doc, key, v]) => ({ ...(doc as object), [key]: v })),
);

/**
 * Photo upload bodies: multipart with a `photo` part (a file of any declared type whose bytes are
 * never a real image), `caption` and `clientId`, sometimes as a plain field, truncated, with a
 * boundary other than the header's, or not multipart at all.
 */
export function photoBodies(): fc.Arbitrary<FuzzBody> {
  const part = fc.oneof(
    fc.tuple(fc.constantFrom('photo', 'caption', 'clientId', 'x'), hostileString).map(([name, v]) => `Content-Disposition: form-data; name="${name}"\r\n\r\n${v}`),
    fc.tuple(fc.constantFrom('photo', 'file'), fc.string({ maxLength: 20 }), fc.constantFrom('image/jpeg', 'image/png', 'image/heic', 'text/plain', ''), fc.string({ maxLength: 400 }))
      .map(([name, file, type, bytes]) => `Content-Disposition: form-data; name="${name}"; filename="${file}"\r\n${type ? `Content-Type: ${type}\r\n` : ''}\r\n${bytes}`),
  );
  const multipart = fc.tuple(fc.array(part, { maxLength: 4 }), fc.constantFrom('fz', 'other'), fc.boolean(), fc.nat({ max: 400 })).map(([parts, boundary, cut, at]) => {
    const body = `${parts.map((p) => `--${boundary}\r\n${p}\r\n`).join('')}--${boundary}--\r\n`;
    return { contentType: 'multipart/form-data; boundary=fz', body: cut ? body.slice(0, at) : body };
  });
  return fc.oneof({ weight: 6, arbitrary: multipart }, { weight: 1, arbitrary: jsonBodies(['photo', 'caption', 'clientId']) });
}
