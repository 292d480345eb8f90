import React from "react";
import { Redirect } from "expo-router";

/** Outgoing e-mail moved out of Money (it holds invitations and password resets too); old links still land. */
export default function OldOutboxRoute() {
  return <Redirect href="/office/outbox" />;
}
