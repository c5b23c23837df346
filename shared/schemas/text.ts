/** The storable-text helpers, shared by every payload schema (they live with the engine's document schema). */
export {
  identifier,
  isStorableText,
  RESERVED_IDS,
  text,
  UNSTORABLE_TEXT_MESSAGE,
} from '../engine/text';
