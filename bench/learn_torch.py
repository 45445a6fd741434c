"""PyTorch peer for bench/learn.ts (benchmark only; never a test or runtime dependency).
Same network as surmise's: p -> H -> H -> H -> 1, ReLU, MSE, Adam (lr 1e-3, eps 1e-7), batch 256,
float32. Prints one JSON object: the seconds of the second training epoch and of input gradients."""
import json
import sys
import time

import torch

args = json.loads(sys.argv[1])
torch.set_num_threads(args["threads"])
torch.manual_seed(0)
p, H = args["p"], args["hidden"]


def net():
    layers, w = [], p
    for _ in range(3):
        layers += [torch.nn.Linear(w, H), torch.nn.ReLU()]
        w = H
    layers.append(torch.nn.Linear(w, 1))
    return torch.nn.Sequential(*layers)


out = {"threads": torch.get_num_threads(), "version": torch.__version__}
if args["what"] == "train":
    n = args["rows"]
    x = torch.randn(n, p)
    y = torch.sin(x[:, :1]) + x[:, 1:2] * x[:, 2:3] + 0.1 * torch.randn(n, 1)
    m = net()
    opt = torch.optim.Adam(m.parameters(), lr=1e-3, eps=1e-7)
    lossf = torch.nn.MSELoss()
    times = []
    for epoch in range(2):
        t0 = time.perf_counter()
        perm = torch.randperm(n)
        for s in range(0, n, 256):
            idx = perm[s : s + 256]
            opt.zero_grad(set_to_none=True)
            loss = lossf(m(x[idx]), y[idx])
            loss.backward()
            opt.step()
        times.append(time.perf_counter() - t0)
    out["epochSeconds"] = times[1]
else:
    n = args["rows"]
    m = net()
    for q in m.parameters():
        q.requires_grad_(False)
    x = torch.randn(n, p)
    t0 = time.perf_counter()
    xs = x.clone().requires_grad_(True)
    m(xs).sum().backward()
    g = xs.grad
    out["seconds"] = time.perf_counter() - t0
    out["check"] = float(g.abs().sum())
print(json.dumps(out))
