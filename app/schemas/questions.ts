import { z } from "zod";

// Shared by the question routes and the Conform forms of the questions panel.
export const QUESTION_MAX = 2000;
export const ANSWER_MAX = 4000;

export const questionSchema = z.object({
  body: z
    .string({ error: "Write your question first." })
    .trim()
    .min(1, "Write your question first.")
    .max(QUESTION_MAX, `Keep the question to ${QUESTION_MAX} characters or fewer; it can be split into two.`),
});

export const answerSchema = z.object({
  answer: z
    .string({ error: "Write the answer first." })
    .trim()
    .min(1, "Write the answer first.")
    .max(ANSWER_MAX, `Keep the answer to ${ANSWER_MAX} characters or fewer.`),
});
