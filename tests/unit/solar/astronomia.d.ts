// astronomia ships no types; the tests use a few of its functions (Meeus, Astronomical Algorithms)
declare module 'astronomia';
