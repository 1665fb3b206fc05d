/** The io layer's public surface: CSV survey import (more io adapters add their exports here). */
export * from './import/index';
