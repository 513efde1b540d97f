export { joinBoardWords, joinWords, splitWords, WORDS_FIELD } from './board-words'
