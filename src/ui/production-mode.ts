/**
 * Imported first by the screen's entry: React picks its production build when NODE_ENV says so at
 * load time, and its development build is several times slower per keystroke. An explicit NODE_ENV
 * (tests, debugging) is left alone.
 */
process.env.NODE_ENV ??= 'production';
