export { joinBoardWords, joinWords, splitWords } from './board-words'
