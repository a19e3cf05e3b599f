import { FormParseError, MAX_INDEX, parseForm, splitKey } from './form-body';

describe('parseForm', () => {
  it('reads plain pairs, decoding + and percent escapes', () => {
    expect(parseForm('mode=payment&customer_email=june%40wrenfield.example&note=sit+and+sew')).toEqual({
      mode: 'payment',
      customer_email: 'june@wrenfield.example',
      note: 'sit and sew',
    });
  });

  it('nests bracketed keys into objects and indexed keys into arrays', () => {
    const body = [
      'line_items[0][price_data][currency]=usd',
      'line_items[0][price_data][unit_amount]=2500',
      'line_items[0][price_data][product_data][name]=Annual%20dues',
      'line_items[0][quantity]=1',
      'line_items[1][quantity]=2',
      'metadata[invoiceId]=12',
      'expand[0]=payment_intent',
    ].join('&');
    expect(parseForm(body)).toEqual({
      line_items: [
        { price_data: { currency: 'usd', unit_amount: '2500', product_data: { name: 'Annual dues' } }, quantity: '1' },
        { quantity: '2' },
      ],
      metadata: { invoiceId: '12' },
      expand: ['payment_intent'],
    });
  });

  it('accepts percent-encoded brackets, as some clients send them', () => {
    expect(parseForm('expand%5B0%5D=line_items&metadata%5Bk%5D=v')).toEqual({ expand: ['line_items'], metadata: { k: 'v' } });
  });

  it('appends for empty brackets and orders indexes numerically, closing gaps', () => {
    expect(parseForm('expand[]=a&expand[]=b')).toEqual({ expand: ['a', 'b'] });
    expect(parseForm('x[10]=ten&x[2]=two&x[0]=zero')).toEqual({ x: ['zero', 'two', 'ten'] });
  });

  it('keeps a mixed container as an object, and the top level always as an object', () => {
    expect(parseForm('m[0]=a&m[b]=c')).toEqual({ m: { 0: 'a', b: 'c' } });
    expect(parseForm('0=a&1=b')).toEqual({ 0: 'a', 1: 'b' });
  });

  it('keeps the last value of a repeated plain key and an empty value as ""', () => {
    expect(parseForm('a=1&a=2&b=&c')).toEqual({ a: '2', b: '', c: '' });
    expect(parseForm('')).toEqual({});
    expect(parseForm('&&')).toEqual({});
  });

  it('treats "__proto__" as an ordinary key', () => {
    const parsed = parseForm('metadata[__proto__]=x&metadata[polluted]=y');
    const meta = parsed.metadata as Record<string, unknown>;
    expect(Object.getPrototypeOf(meta)).toBe(Object.prototype);
    expect(Object.prototype.hasOwnProperty.call(meta, '__proto__')).toBe(true);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });

  it('refuses malformed input with a FormParseError naming the parameter', () => {
    expect(() => parseForm('a=%E0%A4%A')).toThrow(FormParseError);
    expect(() => parseForm('a=1&a[b]=2')).toThrow(/both a value and an object/);
    expect(() => parseForm('a[b]=2&a=1')).toThrow(/both a value and an object/);
    expect(() => parseForm('[x]=1')).toThrow(/Invalid parameter name/);
    expect(() => parseForm('a[b=1')).toThrow(/Invalid parameter name/);
    expect(() => parseForm(`a[${MAX_INDEX + 1}]=1`)).toThrow(/too large/);
    expect(() => parseForm(`a${'[x]'.repeat(9)}=1`)).toThrow(/nested too deeply/);
    try {
      parseForm('metadata=1&metadata[k]=v');
    } catch (err) {
      expect((err as FormParseError).param).toBe('metadata');
    }
  });

  it('splits keys into segments', () => {
    expect(splitKey('a')).toEqual(['a']);
    expect(splitKey('a[b][]')).toEqual(['a', 'b', '']);
  });
});
