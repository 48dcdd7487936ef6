import { mutationOptions, useMutation } from "@tanstack/react-query";
import { apiSendEmpty } from "../../../lib/api";

/** Keeps this session and signs out every other one (server side). */
export function changePassword(body: { currentPassword: string; newPassword: string }) {
  return apiSendEmpty("POST", "/api/account/password", body);
}

export const changePasswordMutationOptions = () =>
  mutationOptions({ mutationKey: ["account", "password"], mutationFn: changePassword });

export function useChangePassword() {
  return useMutation(changePasswordMutationOptions());
}
