// Tests run services directly, outside a React server render; the marker package would throw there.
export {};
