// autocannon 9 ships no types; the bench uses its documented options and its 'response' event only.
declare module 'autocannon';
