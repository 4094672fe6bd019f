// The optimizer's only public face. Pure computation: no I/O, no project imports outside optimizer/.
export {};
