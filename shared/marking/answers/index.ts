export { readTemplateAnswers, readAnswerFile, answersFromTemplateInfo, answerName, type TemplateAnswers, type AnswerFileReading } from './read-template-answers';
