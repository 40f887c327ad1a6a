// The engine's board input is derived in the board's schema module.
export { engineInputOf as boardSizingInput } from './schemas';
