import { enforceRateLimit, findLiveToken } from "./service";
import { touchToken } from "./repo";

/** Records a token's last use without delaying the response; a failure there is logged, not raised. */
export function touchTokenLater(tokenId: number): void {
  touchToken(tokenId).catch((err) => console.error("Could not record token use", err));
}

export { enforceRateLimit, findLiveToken };
