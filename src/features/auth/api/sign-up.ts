import { mutationOptions, useMutation } from "@tanstack/react-query";
import { z } from "zod";
import { type SignUpBody } from "../../../../shared/schemas/auth";
import { apiSend } from "../../../lib/api";

const acceptedSchema = z.object({ message: z.string() });

/** Answers 202 whether or not the address already has an account (no account probing). */
export function signUp(body: SignUpBody): Promise<{ message: string }> {
  return apiSend("POST", "/api/auth/sign-up", acceptedSchema, body);
}

export const signUpMutationOptions = () =>
  mutationOptions({ mutationKey: ["auth", "sign-up"], mutationFn: signUp });

export function useSignUp() {
  return useMutation(signUpMutationOptions());
}
