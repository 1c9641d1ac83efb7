/** Integration tests start compilers, browsers and CLI processes: a generous timeout, stated once. */
import { jest } from '@jest/globals';

jest.setTimeout(600000);
