import type { BlockList } from "node:net";
export function plainAddress(address: string | null | undefined): string;
export function trustedProxies(list: string | null | undefined): BlockList;
export function clientAddressOf(peer: string | null | undefined, forwardedFor: string | string[] | null | undefined, blocks: BlockList): string;
